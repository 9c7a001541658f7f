import { useMutation, useQueryClient } from "@tanstack/react-query";
import { equipmentDtoSchema, type EquipmentInput } from "@shared/sites/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { machineKeys } from "./machine-keys.ts";

/** Revises the machine record (also its state); the site's machine list reads the same row. */
export const saveMachine = (siteId: number, machineId: number, input: EquipmentInput) =>
  api.put(`/sites/${siteId}/equipment/${machineId}`, input, equipmentDtoSchema);

export function useSaveMachine(siteId: number, machineId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: EquipmentInput) => saveMachine(siteId, machineId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: machineKeys.all }),
  });
}
