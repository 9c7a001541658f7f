import type { Response } from "express";
import { z } from "zod";
import { idParam } from "../../shared/credentials/schemas.ts";
import { machineHistoryDtoSchema, recordShopServiceSchema } from "../../shared/machines/service-history.ts";
import { createRoutes } from "../http/route.ts";
import { requireOwnership, requireRole } from "../http/policy.ts";
import { hasOwnedMachine } from "./ownership.ts";
import { AppError } from "../http/app-error.ts";
import { toEquipmentDto } from "../sites/dto.ts";
import { canOpenMachine, ownMachine } from "./machine-routes.ts";
import { listMachineHistory } from "./service-history.ts";
import { recordShopService } from "./record-shop-service.ts";
import { historyToCsv, renderHistoryPage } from "./history-export.ts";
import { historyEntryDtoSchema } from "../../shared/machines/service-history.ts";

export const machineHistoryRoutes = createRoutes("/api/machines");

const machineParamsSchema = z.object({ machineId: idParam });

// A seller keeps a read-only copy of the history up to the day it handed the machine over.
const canReadMachineHistory = requireOwnership(
  requireRole("buyer"),
  "a machine the buyer's shop holds or once held",
  (user, params) => hasOwnedMachine(user.companyId, params.machineId),
);

async function machineOf(user: Express.User, machineId: number) {
  const found = await ownMachine(user.companyId, machineId);
  if (!found) throw new AppError("not_found", "That machine was not found");
  return found;
}

const fileName = (serial: string | null, id: number) =>
  `machine-${(serial ?? String(id)).replace(/[^A-Za-z0-9-]+/g, "_")}-history`;

machineHistoryRoutes.get(
  "/:machineId/history",
  { allow: canReadMachineHistory, params: machineParamsSchema, response: machineHistoryDtoSchema },
  (req, _res, { params }) => listMachineHistory(params.machineId, req.user!.companyId),
);

machineHistoryRoutes.post(
  "/:machineId/history",
  {
    allow: canOpenMachine,
    params: machineParamsSchema,
    body: recordShopServiceSchema,
    response: historyEntryDtoSchema,
  },
  async (req, res, { params, body }) => {
    const { machine } = await machineOf(req.user!, params.machineId);
    const { key } = await recordShopService(req.user!, machine, body);
    const history = await listMachineHistory(machine.id, req.user!.companyId);
    const entry = history.entries.find((e) => e.key === key);
    if (!entry) throw new Error(`The shop record ${key} just saved is missing from the history`);
    res.status(201);
    return entry;
  },
);

machineHistoryRoutes.get(
  "/:machineId/history.csv",
  { allow: canOpenMachine, params: machineParamsSchema },
  async (req, res, { params }) => {
    const { machine } = await machineOf(req.user!, params.machineId);
    const csv = historyToCsv(await listMachineHistory(machine.id, req.user!.companyId));
    res
      .type("text/csv; charset=utf-8")
      .attachment(`${fileName(machine.serialNumber, machine.id)}.csv`)
      .send(csv);
  },
);

function sendPrintable(res: Response, html: string) {
  res.setHeader("Content-Type", "text/html; charset=utf-8");
  // Nothing in the page may run or load: inline style only.
  res.setHeader("Content-Security-Policy", "default-src 'none'; style-src 'unsafe-inline'; font-src 'self'");
  res.setHeader("X-Content-Type-Options", "nosniff");
  res.setHeader("Cache-Control", "private, no-store");
  res.send(html);
}

machineHistoryRoutes.get(
  "/:machineId/history/print",
  { allow: canOpenMachine, params: machineParamsSchema },
  async (req, res, { params }) => {
    const { machine, siteName } = await machineOf(req.user!, params.machineId);
    const history = await listMachineHistory(machine.id, req.user!.companyId);
    sendPrintable(res, renderHistoryPage({ ...toEquipmentDto(machine), siteName }, history));
  },
);
