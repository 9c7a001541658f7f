import { z } from "zod";
import {
  acceptWorkOrderSchema,
  cancelWorkOrderSchema,
  disputeWorkOrderSchema,
  sendAgainSchema,
  completeWorkOrderSchema,
  declineWorkOrderSchema,
  listWorkOrdersQuerySchema,
  messageFileParamsSchema,
  postMessageSchema,
  raiseWorkOrderSchema,
  standingProofQuerySchema,
  workOrderDtoSchema,
  workOrderMessageDtoSchema,
  workOrderParamsSchema,
  workOrderSummaryDtoSchema,
} from "../../shared/work-orders/schemas.ts";
import type { Request } from "express";
import { createRoutes } from "../http/route.ts";
import { singleFileUpload } from "../http/upload.ts";
import { appConfig, linkBase } from "../http/app-locals.ts";
import { appStorage } from "../storage/index.ts";
import { kickOutbox } from "../mail/index.ts";
import { canListWorkOrders, canRaiseWorkOrders, canSeeWorkOrder } from "./policy.ts";
import { raiseWorkOrder } from "./raise-work-order.ts";
import {
  acceptWorkOrder,
  cancelWorkOrder,
  completeWorkOrder,
  confirmWorkOrder,
  declineWorkOrder,
  disputeWorkOrder,
} from "./move-work-order.ts";
import { sendAgain } from "./send-again.ts";
import { findWorkOrder, listWorkOrders } from "./find-work-orders.ts";
import { listMessages, postMessage, sendMessageFile, sendMessageThumbnail } from "./work-order-messages.ts";
import { removeUpload } from "./attachment-file.ts";
import { sendStandingProof } from "./standing-proof.ts";
import { lapsingWindowOf } from "../../shared/standing/warning-windows.ts";

export const workOrderRoutes = createRoutes("/api/work-orders");

// "Lapsing" means inside the widest warning window, as in the stored standings and the daily job.
const warningDays = (req: Request) => lapsingWindowOf(appConfig(req).WARNING_DAYS);
const linkTo = (req: Request) => (id: number) => `${linkBase(req)}/work-orders/${id}`;
const linkToThis = (req: Request, params: { workOrderId: number }) => linkTo(req)(params.workOrderId);

/** Every move of a work order queues its mail in the move's transaction; the outbox is woken once it has committed. */
async function thenSend<T>(req: Request, move: Promise<T>): Promise<T> {
  const dto = await move;
  kickOutbox(req.app.locals);
  return dto;
}

workOrderRoutes.post(
  "",
  { allow: canRaiseWorkOrders, body: raiseWorkOrderSchema, response: workOrderDtoSchema },
  async (req, res, { body }) => {
    const dto = await raiseWorkOrder(req.user!, body, warningDays(req), linkTo(req));
    kickOutbox(req.app.locals);
    res.status(201);
    return dto;
  },
);

workOrderRoutes.get(
  "",
  {
    allow: canListWorkOrders,
    query: listWorkOrdersQuerySchema,
    response: z.array(workOrderSummaryDtoSchema),
  },
  (req, _res, { query }) => listWorkOrders(req.user!, query.status),
);

workOrderRoutes.get(
  "/:workOrderId",
  { allow: canSeeWorkOrder, params: workOrderParamsSchema, response: workOrderDtoSchema },
  (req, _res, { params }) => findWorkOrder(req.user!, params.workOrderId),
);

workOrderRoutes.post(
  "/:workOrderId/accept",
  {
    allow: canSeeWorkOrder,
    params: workOrderParamsSchema,
    body: acceptWorkOrderSchema,
    response: workOrderDtoSchema,
  },
  (req, _res, { params, body }) =>
    thenSend(
      req,
      acceptWorkOrder(req.user!, params.workOrderId, body, warningDays(req), linkToThis(req, params)),
    ),
);

workOrderRoutes.post(
  "/:workOrderId/decline",
  {
    allow: canSeeWorkOrder,
    params: workOrderParamsSchema,
    body: declineWorkOrderSchema,
    response: workOrderDtoSchema,
  },
  (req, _res, { params, body }) =>
    thenSend(req, declineWorkOrder(req.user!, params.workOrderId, body, linkToThis(req, params))),
);

workOrderRoutes.post(
  "/:workOrderId/complete",
  {
    allow: canSeeWorkOrder,
    params: workOrderParamsSchema,
    body: completeWorkOrderSchema,
    response: workOrderDtoSchema,
  },
  (req, _res, { params, body }) =>
    thenSend(
      req,
      completeWorkOrder(req.user!, params.workOrderId, body, warningDays(req), linkToThis(req, params)),
    ),
);

workOrderRoutes.post(
  "/:workOrderId/confirm",
  { allow: canSeeWorkOrder, params: workOrderParamsSchema, response: workOrderDtoSchema },
  (req, _res, { params }) =>
    thenSend(req, confirmWorkOrder(req.user!, params.workOrderId, linkToThis(req, params))),
);

workOrderRoutes.post(
  "/:workOrderId/dispute",
  {
    allow: canSeeWorkOrder,
    params: workOrderParamsSchema,
    body: disputeWorkOrderSchema,
    response: workOrderDtoSchema,
  },
  (req, _res, { params, body }) =>
    thenSend(req, disputeWorkOrder(req.user!, params.workOrderId, body.reason, linkToThis(req, params))),
);

workOrderRoutes.post(
  "/:workOrderId/cancel",
  {
    allow: canSeeWorkOrder,
    params: workOrderParamsSchema,
    body: cancelWorkOrderSchema,
    response: workOrderDtoSchema,
  },
  (req, _res, { params, body }) =>
    thenSend(req, cancelWorkOrder(req.user!, params.workOrderId, body.reason, linkToThis(req, params))),
);

// The copy is a new work order (201); the declined one stays as it was, pointing at its copies.
workOrderRoutes.post(
  "/:workOrderId/send-again",
  {
    allow: canSeeWorkOrder,
    params: workOrderParamsSchema,
    body: sendAgainSchema,
    response: workOrderDtoSchema,
  },
  async (req, res, { params, body }) => {
    const dto = await sendAgain(req.user!, params.workOrderId, body, warningDays(req), linkTo(req));
    kickOutbox(req.app.locals);
    res.status(201);
    return dto;
  },
);

workOrderRoutes.get(
  "/:workOrderId/standing-proof",
  { allow: canSeeWorkOrder, params: workOrderParamsSchema, query: standingProofQuerySchema },
  (req, res, { params, query }) => sendStandingProof(req.user!, params.workOrderId, query.at, res),
);

workOrderRoutes.get(
  "/:workOrderId/messages",
  { allow: canSeeWorkOrder, params: workOrderParamsSchema, response: z.array(workOrderMessageDtoSchema) },
  (req, _res, { params }) => listMessages(req.user!, params.workOrderId),
);

// JSON or multipart (field `body`, optional part `file`). The body is checked inside the handler so that a refused
// field still removes multer's temporary file before the answer goes out.
workOrderRoutes.post(
  "/:workOrderId/messages",
  {
    allow: canSeeWorkOrder,
    params: workOrderParamsSchema,
    before: [singleFileUpload],
    response: workOrderMessageDtoSchema,
    status: 201,
  },
  async (req, _res, { params }) => {
    try {
      const { body } = postMessageSchema.parse(req.body ?? {});
      const dto = await postMessage(
        req.user!,
        params.workOrderId,
        body,
        req.file,
        appStorage(req),
        linkTo(req)(params.workOrderId),
      );
      kickOutbox(req.app.locals);
      return dto;
    } finally {
      await removeUpload(req.file);
    }
  },
);

workOrderRoutes.get(
  "/:workOrderId/messages/:messageId/file",
  { allow: canSeeWorkOrder, params: messageFileParamsSchema },
  (req, res, { params }) =>
    sendMessageFile(req.user!, params.workOrderId, params.messageId, appStorage(req), res),
);

workOrderRoutes.get(
  "/:workOrderId/messages/:messageId/thumbnail",
  { allow: canSeeWorkOrder, params: messageFileParamsSchema },
  (req, res, { params }) => sendMessageThumbnail(req.user!, params.workOrderId, params.messageId, res),
);
