import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { caughtMailSchema } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { adminKeys } from "./admin-keys.ts";

export const getOutbox = () => api.get("/admin/outbox", z.array(caughtMailSchema));

export const outboxQuery = () =>
  queryOptions({ queryKey: adminKeys.outbox(), queryFn: getOutbox, staleTime: 0 });

export const useOutbox = () => useQuery(outboxQuery());
