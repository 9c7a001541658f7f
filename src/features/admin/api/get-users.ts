import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { adminUserDtoSchema, type AdminUserDto } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { adminKeys } from "./admin-keys.ts";

export type AdminUser = AdminUserDto;

export const getUsers = () => api.get("/admin/users", z.array(adminUserDtoSchema));

export const usersQuery = () => queryOptions({ queryKey: adminKeys.users(), queryFn: getUsers });

export const useUsers = () => useQuery(usersQuery());
