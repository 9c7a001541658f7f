import { requireRole } from "../http/policy.ts";

export const canManageUsers = requireRole("admin");
