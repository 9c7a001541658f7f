import { machineParamsSchema } from "../../shared/machines/photos.ts";
import { z } from "zod";
import {
  acceptTransferSchema,
  declineTransferSchema,
  machineTransferListSchema,
  machineTransferSchema,
  ownershipViewSchema,
  startTransferSchema,
  transferParamsSchema,
} from "../../shared/machines/transfers.ts";
import { createRoutes } from "../http/route.ts";
import { linkBase } from "../http/app-locals.ts";
import { kickOutbox } from "../mail/index.ts";
import {
  canAnswerTransfer,
  canListTransfers,
  canSeeMachineOwnership,
  canSeeTransfer,
  canTransferMachine,
  canWithdrawTransfer,
} from "./transfer-policy.ts";
import { findTransfer, listMachineTransfers, listShopTransfers } from "./transfer-read.ts";
import { startTransfer } from "./transfer-start.ts";
import { acceptTransfer, declineTransfer, withdrawTransfer } from "./transfer-decide.ts";
import { ownershipView } from "./ownership.ts";

export const machineTransferStartRoutes = createRoutes("/api/machines");

machineTransferStartRoutes.get(
  "/:machineId/transfers",
  { allow: canTransferMachine, params: machineParamsSchema, response: z.array(machineTransferSchema) },
  (req, _res, { params }) => listMachineTransfers(req.user!.companyId, params.machineId),
);

machineTransferStartRoutes.post(
  "/:machineId/transfers",
  {
    allow: canTransferMachine,
    params: machineParamsSchema,
    body: startTransferSchema,
    response: machineTransferSchema,
  },
  async (req, res, { params, body }) => {
    const transfer = await startTransfer(req.user!, params.machineId, body, linkBase(req));
    kickOutbox(req.app.locals);
    res.status(201);
    return transfer;
  },
);

machineTransferStartRoutes.get(
  "/:machineId/ownership",
  { allow: canSeeMachineOwnership, params: machineParamsSchema, response: ownershipViewSchema },
  (req, _res, { params }) => ownershipView(req.user!.companyId, params.machineId),
);

export const machineTransferRoutes = createRoutes("/api/machine-transfers");

machineTransferRoutes.get("", { allow: canListTransfers, response: machineTransferListSchema }, (req) =>
  listShopTransfers(req.user!.companyId),
);

machineTransferRoutes.get(
  "/:transferId",
  { allow: canSeeTransfer, params: transferParamsSchema, response: machineTransferSchema },
  (req, _res, { params }) => findTransfer(req.user!.companyId, params.transferId),
);

machineTransferRoutes.post(
  "/:transferId/accept",
  {
    allow: canAnswerTransfer,
    params: transferParamsSchema,
    body: acceptTransferSchema,
    response: machineTransferSchema,
  },
  async (req, _res, { params, body }) => {
    const transfer = await acceptTransfer(req.user!, params.transferId, body, linkBase(req));
    kickOutbox(req.app.locals);
    return transfer;
  },
);

machineTransferRoutes.post(
  "/:transferId/decline",
  {
    allow: canAnswerTransfer,
    params: transferParamsSchema,
    body: declineTransferSchema,
    response: machineTransferSchema,
  },
  async (req, _res, { params, body }) => {
    const transfer = await declineTransfer(req.user!, params.transferId, body.reason, linkBase(req));
    kickOutbox(req.app.locals);
    return transfer;
  },
);

machineTransferRoutes.post(
  "/:transferId/withdraw",
  { allow: canWithdrawTransfer, params: transferParamsSchema, response: machineTransferSchema },
  async (req, _res, { params }) => {
    const transfer = await withdrawTransfer(req.user!, params.transferId, linkBase(req));
    kickOutbox(req.app.locals);
    return transfer;
  },
);
