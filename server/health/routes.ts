import { QueryTypes } from "sequelize";
import { livenessDtoSchema, readinessDtoSchema, type ReadinessDto } from "../../shared/health/schemas.ts";
import { createRoutes } from "../http/route.ts";
import { anyone } from "../http/policy.ts";
import { primaryDb } from "../db/sequelize.ts";
import { replicaHealth } from "../db/replica.ts";
import type { Readiness } from "./readiness.ts";

export const healthRoutes = createRoutes("/api");

const DATABASE_CHECK_MS = 2_000;

async function databaseUp(): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  try {
    return await Promise.race([
      primaryDb()
        .query("SELECT 1", { type: QueryTypes.SELECT })
        .then(() => true),
      new Promise<boolean>((resolve) => (timer = setTimeout(() => resolve(false), DATABASE_CHECK_MS))),
    ]);
  } catch {
    return false;
  } finally {
    clearTimeout(timer);
  }
}

// Readiness: a load balancer sends traffic only while this answers 200 (started, and the primary database answers).
for (const path of ["/health", "/health/ready"]) {
  healthRoutes.get(path, { allow: anyone, response: readinessDtoSchema }, async (req, res) => {
    const starting = (req.app.locals.readiness as Readiness | undefined)?.starting ?? [];
    const [primaryUp, replica] = await Promise.all([databaseUp(), replicaHealth(DATABASE_CHECK_MS)]);
    const database = primaryUp ? "up" : "down";
    const status = starting.length ? "starting" : database === "up" ? "ok" : "degraded";
    // A replica that is down is reported but never fails readiness: its reads fall back to the primary.
    const replicaPart = replica.replica === "none" ? {} : { ...replica, replica: replica.replica };
    const body: ReadinessDto = starting.length
      ? { status, database, ...replicaPart, starting }
      : { status, database, ...replicaPart };
    if (status !== "ok") res.status(503);
    return body;
  });
}

// Liveness: the process answers; restart it only when this fails (never because the database is down).
healthRoutes.get("/health/live", { allow: anyone, response: livenessDtoSchema }, () => ({
  status: "alive" as const,
}));
