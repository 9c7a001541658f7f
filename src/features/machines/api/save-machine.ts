import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { EquipmentInput } from "@shared/sites/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { machineKeys } from "./machine-keys.ts";
import { machineSchema } from "./machine-shapes.ts";

const savedSchema = machineSchema.omit({ siteName: true });

/** Revises the machine record (also its state); the site's machine list reads the same row. */
export const saveMachine = (siteId: number, machineId: number, input: EquipmentInput) =>
  api.put(`/sites/${siteId}/equipment/${machineId}`, input, savedSchema);

export function useSaveMachine(siteId: number, machineId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: EquipmentInput) => saveMachine(siteId, machineId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: machineKeys.all }),
  });
}
