import { useMutation, useQueryClient } from "@tanstack/react-query";
import { technicianDtoSchema, type TechnicianInput } from "@shared/technicians/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { technicianKeys } from "./technician-keys.ts";

export type EditTechnicianInput = { id: number; input: TechnicianInput };

export const editTechnician = ({ id, input }: EditTechnicianInput) =>
  api.put(`/technicians/${id}`, input, technicianDtoSchema);

export function useEditTechnician() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: editTechnician,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: technicianKeys.all }),
  });
}
