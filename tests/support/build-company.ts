import { randomUUID } from "node:crypto";
import type { CompanyKind, Role } from "../../shared/accounts/schemas.ts";
import { Company } from "../../server/companies/model.ts";
import { User } from "../../server/accounts/model.ts";
import { hashPassword } from "../../server/accounts/passwords.ts";

export const TEST_PASSWORD = "correct horse battery";

/** A company of its own for each test, with one user per role asked for. */
export async function buildCompany(
  kind: CompanyKind,
  roles: Role[],
  overrides: Partial<{ name: string; timeZone: string; postalCode: string }> = {},
) {
  const tag = randomUUID().slice(0, 8);
  const company = await Company.create({
    name: overrides.name ?? `Test ${kind} ${tag} LLC`,
    kind,
    addressLine: "1 Test Lane",
    postalCode: overrides.postalCode ?? "60601",
    timeZone: overrides.timeZone ?? "America/Chicago",
    latitude: 41.8858,
    longitude: -87.6181,
  });
  const passwordHash = await hashPassword(TEST_PASSWORD);
  const users: Partial<Record<Role, User>> = {};
  for (const role of roles) {
    users[role] = await User.create({
      companyId: company.id,
      email: `${role}-${tag}@example.test`,
      name: `${role} ${tag}`,
      role,
      passwordHash,
    });
  }
  return { company, users, tag };
}
