import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { workOrderKeys } from "./work-order-keys.ts";
import { workOrderDtoSchema } from "@shared/work-orders/schemas.ts";

export const getWorkOrder = (id: number) => api.get(`/work-orders/${id}`, workOrderDtoSchema);

export const workOrderQuery = (id: number) =>
  queryOptions({ queryKey: workOrderKeys.detail(id), queryFn: () => getWorkOrder(id) });

export const useWorkOrder = (id: number) => useQuery(workOrderQuery(id));
