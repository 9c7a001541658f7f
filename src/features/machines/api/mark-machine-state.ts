import { useMutation, useQueryClient } from "@tanstack/react-query";
import { machineDowntimeSchema, type MarkMachineState } from "@shared/machines/downtime-schemas.ts";
import { api } from "@/lib/api-client.ts";
import { machineKeys } from "./machine-keys.ts";

/** The shop says its machine stopped or runs again; the answer is the downtime panel as it now stands. */
export const markMachineState = (machineId: number, input: MarkMachineState) =>
  api.post(`/machines/${machineId}/running-state`, input, machineDowntimeSchema);

export function useMarkMachineState(machineId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: MarkMachineState) => markMachineState(machineId, input),
    onSuccess: (downtime) => {
      queryClient.setQueryData(machineKeys.downtime(machineId), downtime);
      // The record's state and the machines list show the change too.
      return queryClient.invalidateQueries({ queryKey: machineKeys.detail(machineId) });
    },
  });
}
