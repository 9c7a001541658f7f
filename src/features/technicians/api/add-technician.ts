import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { TechnicianInput } from "@shared/technicians/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { technicianKeys } from "./technician-keys.ts";
import { technicianSchema } from "./technician-shape.ts";

export const addTechnician = (input: TechnicianInput) => api.post("/technicians", input, technicianSchema);

export function useAddTechnician() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addTechnician,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: technicianKeys.all }),
  });
}
