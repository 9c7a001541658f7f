import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { siteKeys } from "./site-keys.ts";

export const removeEquipment = ({ siteId, equipmentId }: { siteId: number; equipmentId: number }) =>
  api.send("DELETE", `/sites/${siteId}/equipment/${equipmentId}`);

export function useRemoveEquipment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeEquipment,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: siteKeys.all }),
  });
}
