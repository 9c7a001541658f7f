import { createRoutes } from "../http/route.ts";
import { requireRole } from "../http/policy.ts";
import { linkBase } from "../http/app-locals.ts";
import { kickOutbox } from "../mail/outbox.ts";
import { runDailyJobNow } from "./run-daily-job.ts";

export const adminJobRoutes = createRoutes("/api/admin");

const canRunJobs = requireRole("admin");

adminJobRoutes.post("/job-runs/lapse", { allow: canRunJobs }, async (req, res) => {
  const run = await runDailyJobNow(req.user!, linkBase(req));
  kickOutbox(req.app.locals);
  res.status(201).json(run);
});
