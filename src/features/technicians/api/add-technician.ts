import { useMutation, useQueryClient } from "@tanstack/react-query";
import { technicianDtoSchema, type TechnicianInput } from "@shared/technicians/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { technicianKeys } from "./technician-keys.ts";

export const addTechnician = (input: TechnicianInput) => api.post("/technicians", input, technicianDtoSchema);

export function useAddTechnician() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addTechnician,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: technicianKeys.all }),
  });
}
