import { useMutation, useQueryClient } from "@tanstack/react-query";
import {
  machineTransferSchema,
  type AcceptTransfer,
  type StartTransfer,
} from "@shared/machines/transfers.ts";
import { api } from "@/lib/api-client.ts";
import { machineTransferKeys } from "./machine-transfer-keys.ts";

export const startMachineTransfer = ({ machineId, input }: { machineId: number; input: StartTransfer }) =>
  api.post(`/machines/${machineId}/transfers`, input, machineTransferSchema);

export const acceptMachineTransfer = ({ transferId, input }: { transferId: number; input: AcceptTransfer }) =>
  api.post(`/machine-transfers/${transferId}/accept`, input, machineTransferSchema);

export const declineMachineTransfer = ({ transferId, reason }: { transferId: number; reason?: string }) =>
  api.post(`/machine-transfers/${transferId}/decline`, reason ? { reason } : {}, machineTransferSchema);

export const withdrawMachineTransfer = (transferId: number) =>
  api.post(`/machine-transfers/${transferId}/withdraw`, {}, machineTransferSchema);

// A decision moves a machine between shops: transfers, machine lists, sites' machine counts and the bell all change.
function useTransferMutation<V>(fn: (v: V) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: machineTransferKeys.all });
      void queryClient.invalidateQueries();
    },
  });
}

export const useStartMachineTransfer = () => useTransferMutation(startMachineTransfer);
export const useAcceptMachineTransfer = () => useTransferMutation(acceptMachineTransfer);
export const useDeclineMachineTransfer = () => useTransferMutation(declineMachineTransfer);
export const useWithdrawMachineTransfer = () => useTransferMutation(withdrawMachineTransfer);
