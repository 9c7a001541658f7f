import { z } from "zod";
import { idParam } from "../../shared/credentials/schemas.ts";
import { machineDowntimeSchema, markMachineStateSchema } from "../../shared/machines/downtime-schemas.ts";
import { createRoutes } from "../http/route.ts";
import { canOpenMachine } from "./machine-routes.ts";
import { readMachineDowntime } from "./downtime.ts";
import { markMachineState } from "./mark-machine-state.ts";

export const machineDowntimeRoutes = createRoutes("/api/machines");

const machineParamsSchema = z.object({ machineId: idParam });

machineDowntimeRoutes.get(
  "/:machineId/downtime",
  { allow: canOpenMachine, params: machineParamsSchema, response: machineDowntimeSchema },
  (_req, _res, { params }) => readMachineDowntime(params.machineId, new Date()),
);

// Answers the panel as it now stands, so the page shows the new period (or its end) without a second request.
machineDowntimeRoutes.post(
  "/:machineId/running-state",
  {
    allow: canOpenMachine,
    params: machineParamsSchema,
    body: markMachineStateSchema,
    response: machineDowntimeSchema,
  },
  async (req, _res, { params, body }) => {
    const now = new Date();
    await markMachineState(req.user!, params.machineId, body, now);
    return readMachineDowntime(params.machineId, now);
  },
);
