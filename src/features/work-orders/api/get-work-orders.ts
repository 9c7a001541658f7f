import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { type WorkOrderStatus, workOrderSummaryDtoSchema } from "@shared/work-orders/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { workOrderKeys } from "./work-order-keys.ts";

/** The caller's side's work orders, newest first, optionally of one status. */
export const getWorkOrders = (status: WorkOrderStatus | null) =>
  api.get(status ? `/work-orders?status=${status}` : "/work-orders", z.array(workOrderSummaryDtoSchema));

export const workOrdersQuery = (status: WorkOrderStatus | null) =>
  queryOptions({ queryKey: workOrderKeys.list(status), queryFn: () => getWorkOrders(status) });

export const useWorkOrders = (status: WorkOrderStatus | null) => useQuery(workOrdersQuery(status));
