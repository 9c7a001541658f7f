import { useMutation, useQueryClient } from "@tanstack/react-query";
import { equipmentDtoSchema, type EquipmentInput } from "@shared/sites/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { siteKeys } from "./site-keys.ts";

type SaveEquipment = { siteId: number; equipmentId?: number | undefined; input: EquipmentInput };

/** Adds a machine to a site, or revises one when `equipmentId` is given. */
export const saveEquipment = ({ siteId, equipmentId, input }: SaveEquipment) =>
  equipmentId
    ? api.put(`/sites/${siteId}/equipment/${equipmentId}`, input, equipmentDtoSchema)
    : api.post(`/sites/${siteId}/equipment`, input, equipmentDtoSchema);

export function useSaveEquipment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveEquipment,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: siteKeys.all }),
  });
}
