import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { roleSchema } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { adminKeys } from "./admin-keys.ts";

// Shape of GET /api/admin/users; shared/ has no schema for it yet.
export const adminUserSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  companyId: z.number(),
  companyName: z.string(),
});
export type AdminUser = z.infer<typeof adminUserSchema>;

export const getUsers = () => api.get("/admin/users", z.array(adminUserSchema));

export const usersQuery = () => queryOptions({ queryKey: adminKeys.users(), queryFn: getUsers });

export const useUsers = () => useQuery(usersQuery());
