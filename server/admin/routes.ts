import { createRoutes } from "../http/route.ts";
import { requireRole } from "../http/policy.ts";
import { linkBase } from "../http/app-locals.ts";
import { kickOutbox } from "../mail/outbox.ts";
import { runDailyJobNow } from "./run-daily-job.ts";
import { manualJobRunDtoSchema } from "../../shared/standing/schemas.ts";

export const adminJobRoutes = createRoutes("/api/admin");

const canRunJobs = requireRole("admin");

adminJobRoutes.post(
  "/job-runs/lapse",
  { allow: canRunJobs, response: manualJobRunDtoSchema },
  async (req, res) => {
    const run = await runDailyJobNow(req.user!, linkBase(req));
    kickOutbox(req.app.locals);
    res.status(201);
    return run;
  },
);
