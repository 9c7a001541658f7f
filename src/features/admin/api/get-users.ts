import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { roleSchema, userStatuses } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { adminKeys } from "./admin-keys.ts";

// Run-time check of shared/accounts/schemas.ts AdminUserDto.
export const adminUserSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  companyId: z.number(),
  companyName: z.string(),
  status: z.enum(userStatuses),
});
export type AdminUser = z.infer<typeof adminUserSchema>;

export const getUsers = () => api.get("/admin/users", z.array(adminUserSchema));

export const usersQuery = () => queryOptions({ queryKey: adminKeys.users(), queryFn: getUsers });

export const useUsers = () => useQuery(usersQuery());
