import type { CurrentUser } from "../../shared/accounts/schemas.ts";
import type { User } from "./model.ts";
import { type Company } from "../db/models.ts";

export function toCurrentUserDto(user: User, company: Company): CurrentUser {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    companyId: company.id,
    companyName: company.name,
    companyKind: company.kind,
    technicianId: user.technicianId ?? null,
  };
}

export function toSessionUser(user: User): Express.User {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    companyId: user.companyId,
    technicianId: user.technicianId ?? null,
  };
}
