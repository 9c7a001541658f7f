import { useMutation, useQueryClient } from "@tanstack/react-query";
import { type RecordShopService, historyEntryDtoSchema } from "@shared/machines/service-history.ts";
import { api } from "@/lib/api-client.ts";
import { machineKeys } from "./machine-keys.ts";

/** Work done outside the platform, written into the machine's history as the shop's own record. */
export const recordShopService = (machineId: number, input: RecordShopService) =>
  api.post(`/machines/${machineId}/history`, input, historyEntryDtoSchema);

export function useRecordShopService(machineId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: RecordShopService) => recordShopService(machineId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: machineKeys.history(machineId) }),
  });
}
