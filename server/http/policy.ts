import type { Role } from "../../shared/accounts/schemas.ts";

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface User {
      id: number;
      email: string;
      name: string;
      role: Role;
      companyId: number;
      technicianId: number | null;
    }
  }
}

export type SignedInUser = Express.User;

/**
 * Who may call a route. `roles` is checked first (401 when signed out, 403 for a wrong role);
 * `owns` then checks the object named in the params; a foreign object answers 404 exactly like a
 * missing one, so ids of other companies never reveal that they exist.
 */
export interface Policy {
  readonly name: string;
  readonly roles: readonly Role[] | "anyone" | "signed_in";
  readonly owns?: (user: SignedInUser, params: Record<string, unknown>) => Promise<boolean> | boolean;
}

export const anyone: Policy = { name: "anyone", roles: "anyone" };
export const signedIn: Policy = { name: "signed in", roles: "signed_in" };

export function requireRole(...roles: Role[]): Policy {
  return { name: roles.join(" or "), roles };
}

/** A role rule plus an ownership check on the route's object. */
export function requireOwnership(
  base: Policy,
  name: string,
  owns: (user: SignedInUser, params: Record<string, unknown>) => Promise<boolean> | boolean,
): Policy {
  return { ...base, name: `${base.name}, ${name}`, owns };
}

export function hasRole(policy: Policy, role: Role): boolean {
  if (policy.roles === "anyone" || policy.roles === "signed_in") return true;
  return policy.roles.includes(role);
}
