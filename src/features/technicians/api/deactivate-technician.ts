import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { technicianKeys } from "./technician-keys.ts";
import { technicianDtoSchema } from "@shared/technicians/schemas.ts";

export const deactivateTechnician = (id: number) =>
  api.post(`/technicians/${id}/deactivate`, {}, technicianDtoSchema);

export function useDeactivateTechnician() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deactivateTechnician,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: technicianKeys.all }),
  });
}
