import { insertDemoServiceRequests } from "./service-requests.ts";
import { insertDemoMachineHistory } from "./machine-history.ts";
import { insertDemoMachineDowntime } from "./machine-downtime.ts";
import { insertDemoMaintenancePlans } from "./maintenance-plans.ts";
import { hashPassword } from "../../accounts/passwords.ts";
import { refreshAllStandings } from "../../standing/index.ts";
import { createStorage } from "../../storage/index.ts";
import { db } from "../sequelize.ts";
import { buildDemoWorld } from "./build-demo-world.ts";
import { demoCompanies } from "./companies.ts";
import { insertDemoWorld } from "./insert-demo-world.ts";
import { insertDemoBuyerSite } from "./buyer-site.ts";
import { commitStagedFiles, discardStagedFiles, stageDemoFiles } from "./stage-demo-files.ts";
import { Company, User } from "../models.ts";

export { buildDemoWorld } from "./build-demo-world.ts";

export const DEMO_PASSWORD = "clearbench-demo";

export const demoSignIns = demoCompanies.flatMap((c) =>
  c.users.map((u) => ({ role: u.role, email: u.email, company: c.name })),
);

export interface DemoLoadOptions {
  /** Where uploads live (config.UPLOADS_DIR); the demo's PDFs are stored there like real uploads. */
  uploadsDir: string;
  /** The demo's "today": every date in the scenario is relative to it. The caller passes the real date. */
  today?: Date;
}

/**
 * Loads the invented demo world into an empty database: companies, users, technicians, credentials in every state
 * with their generated PDFs, the audit trail, and the standings as of `today`. Returns false when data is already
 * there. Rows commit in one transaction; files are moved into storage only after it commits.
 */
export async function loadDemoScenarioOnce({
  uploadsDir,
  today = new Date(),
}: DemoLoadOptions): Promise<boolean> {
  if ((await Company.count()) > 0 || (await User.count()) > 0) return false;
  const world = buildDemoWorld(today);
  const storage = createStorage(uploadsDir);
  const [passwordHash, files] = await Promise.all([
    hashPassword(DEMO_PASSWORD),
    stageDemoFiles(world.credentials, storage),
  ]);
  try {
    await db().transaction(async (transaction) => {
      await insertDemoWorld(world, files, passwordHash, transaction);
      await insertDemoBuyerSite(transaction);
      await afterDemoLoaded(today, transaction);
      await insertDemoServiceRequests(today, transaction);
      await insertDemoMachineHistory(today, transaction);
      await insertDemoMachineDowntime(today, transaction);
      await insertDemoMaintenancePlans(today, transaction);
    });
  } catch (err) {
    await discardStagedFiles(files.values());
    throw err;
  }
  await commitStagedFiles(files.values(), storage);
  return true;
}

/** Computes every technician's standing as of the demo's today, so the directory and dashboards start filled in. */
export async function afterDemoLoaded(
  asOf: Date,
  transaction: Parameters<typeof refreshAllStandings>[1],
): Promise<void> {
  await refreshAllStandings(asOf, transaction);
}
