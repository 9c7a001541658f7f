import { createRoutes } from "../http/route.ts";
import { anyone } from "../http/policy.ts";
import { db } from "../db/sequelize.ts";

export const healthRoutes = createRoutes("/api");

healthRoutes.get("/health", { allow: anyone }, async (_req, res) => {
  try {
    await db().query("SELECT 1");
    return { status: "ok", database: "up" };
  } catch {
    res.status(503).json({ status: "degraded", database: "down" });
  }
});
