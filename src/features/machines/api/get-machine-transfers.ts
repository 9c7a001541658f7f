import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { machineTransferListSchema, machineTransferSchema } from "@shared/machines/transfers.ts";
import { api } from "@/lib/api-client.ts";
import { machineTransferKeys } from "./machine-transfer-keys.ts";

export const getMachineTransfers = () => api.get("/machine-transfers", machineTransferListSchema);

export const machineTransfersQuery = () =>
  queryOptions({ queryKey: machineTransferKeys.list(), queryFn: getMachineTransfers });

export const useMachineTransfers = () => useQuery(machineTransfersQuery());

export const getTransfersOfMachine = (machineId: number) =>
  api.get(`/machines/${machineId}/transfers`, z.array(machineTransferSchema));

export const transfersOfMachineQuery = (machineId: number) =>
  queryOptions({
    queryKey: machineTransferKeys.ofMachine(machineId),
    queryFn: () => getTransfersOfMachine(machineId),
  });
