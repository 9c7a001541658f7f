import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { workOrderKeys } from "./work-order-keys.ts";
import { workOrderMessageDtoSchema } from "@shared/work-orders/schemas.ts";

export const getWorkOrderMessages = (id: number) =>
  api.get(`/work-orders/${id}/messages`, z.array(workOrderMessageDtoSchema));

export const workOrderMessagesQuery = (id: number) =>
  queryOptions({ queryKey: workOrderKeys.messages(id), queryFn: () => getWorkOrderMessages(id) });

export const useWorkOrderMessages = (id: number) => useQuery(workOrderMessagesQuery(id));
