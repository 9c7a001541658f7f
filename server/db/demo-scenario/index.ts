import { Company } from "../../companies/model.ts";
import { User } from "../../accounts/model.ts";
import { hashPassword } from "../../accounts/passwords.ts";
import { db } from "../sequelize.ts";
import { demoCompanies } from "./companies.ts";

export const DEMO_PASSWORD = "clearbench-demo";

export const demoSignIns = demoCompanies.flatMap((c) => c.users.map((u) => ({ role: u.role, email: u.email, company: c.name })));

/** Loads the invented demo world into an empty database; returns false when data is already there. */
export async function loadDemoScenarioOnce(): Promise<boolean> {
  if ((await Company.count()) > 0) return false;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db().transaction(async (transaction) => {
    for (const c of demoCompanies) {
      const company = await Company.create(
        { name: c.name, kind: c.kind, addressLine: c.addressLine, postalCode: c.postalCode, timeZone: c.timeZone, latitude: null, longitude: null },
        { transaction },
      );
      for (const u of c.users) {
        await User.create({ companyId: company.id, email: u.email, name: u.name, role: u.role, passwordHash }, { transaction });
      }
    }
  });
  return true;
}
