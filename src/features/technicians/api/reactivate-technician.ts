import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { technicianKeys } from "./technician-keys.ts";
import { technicianDtoSchema } from "@shared/technicians/schemas.ts";

export const reactivateTechnician = (id: number) =>
  api.post(`/technicians/${id}/reactivate`, {}, technicianDtoSchema);

export function useReactivateTechnician() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: reactivateTechnician,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: technicianKeys.all }),
  });
}
