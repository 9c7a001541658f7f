import type { Request } from "express";
import { z } from "zod";
import {
  attachmentParamsSchema,
  comparisonDtoSchema,
  attachmentAddedDtoSchema,
  followUpLoggedDtoSchema,
  followUpRowDtoSchema,
  requestMessageDtoSchema,
  routingPreviewDtoSchema,
  serviceRequestDtoSchema,
  serviceRequestSummaryDtoSchema,
  cancelRequestSchema,
  estimateInputSchema,
  estimateParamsSchema,
  followUpNoteSchema,
  passSchema,
  raiseServiceRequestSchema,
  requestMessageSchema,
  serviceRequestParamsSchema,
  threadFileParamsSchema,
  threadParamsSchema,
} from "../../shared/service-requests/schemas.ts";
import { createRoutes } from "../http/route.ts";
import { singleFileUpload } from "../http/upload.ts";
import { appConfig, linkBase } from "../http/app-locals.ts";
import { appStorage } from "../storage/index.ts";
import { kickOutbox } from "../mail/index.ts";
import { removeUpload } from "../work-orders/attachment-file.ts";
import {
  canAnswerServiceRequest,
  canDecideServiceRequest,
  canFollowUp,
  canListServiceRequests,
  canRaiseServiceRequests,
  canSeeServiceRequest,
  canSeeThread,
} from "./policy.ts";
import { previewServiceRequest, raiseServiceRequest } from "./raise-request.ts";
import { listRequests, viewRequest } from "./view-request.ts";
import { passRequest, reviseEstimate, sendEstimate, withdrawEstimate } from "./estimates.ts";
import { acceptEstimate, cancelRequest } from "./decide.ts";
import { compareEstimates } from "./comparison.ts";
import {
  addRequestAttachment,
  listThread,
  postThreadMessage,
  sendRequestAttachment,
  sendThreadFile,
} from "./files.ts";
import { listFollowUps, logFollowUp } from "./follow-up.ts";
import { lapsingWindowOf } from "../../shared/standing/warning-windows.ts";

export const serviceRequestRoutes = createRoutes("/api/service-requests");

// "Lapsing" means inside the widest warning window, as everywhere else.
const warningDays = (req: Request) => lapsingWindowOf(appConfig(req).WARNING_DAYS);
const kick = (req: Request) => kickOutbox(req.app.locals);

serviceRequestRoutes.post(
  "/preview",
  { allow: canRaiseServiceRequests, body: raiseServiceRequestSchema, response: routingPreviewDtoSchema },
  (req, _res, { body }) => previewServiceRequest(req.user!, body),
);

serviceRequestRoutes.post(
  "",
  { allow: canRaiseServiceRequests, body: raiseServiceRequestSchema, response: serviceRequestDtoSchema },
  async (req, res, { body }) => {
    const created = await raiseServiceRequest(req.user!, body, linkBase(req));
    kick(req);
    res.status(201);
    return await viewRequest(req.user!, created.id);
  },
);

serviceRequestRoutes.get(
  "",
  { allow: canListServiceRequests, response: z.array(serviceRequestSummaryDtoSchema) },
  (req) => listRequests(req.user!),
);

serviceRequestRoutes.get("/follow-up", { allow: canFollowUp, response: z.array(followUpRowDtoSchema) }, () =>
  listFollowUps(),
);

serviceRequestRoutes.get(
  "/:requestId",
  { allow: canSeeServiceRequest, params: serviceRequestParamsSchema, response: serviceRequestDtoSchema },
  (req, _res, { params }) => viewRequest(req.user!, params.requestId),
);

serviceRequestRoutes.get(
  "/:requestId/comparison",
  { allow: canDecideServiceRequest, params: serviceRequestParamsSchema, response: comparisonDtoSchema },
  (req, _res, { params }) => compareEstimates(req.user!, params.requestId, warningDays(req)),
);

serviceRequestRoutes.post(
  "/:requestId/attachments",
  {
    allow: canDecideServiceRequest,
    params: serviceRequestParamsSchema,
    before: [singleFileUpload],
    response: attachmentAddedDtoSchema,
    status: 201,
  },
  async (req, _res, { params }) => {
    try {
      return await addRequestAttachment(req.user!, params.requestId, req.file, appStorage(req));
    } finally {
      await removeUpload(req.file);
    }
  },
);

serviceRequestRoutes.get(
  "/:requestId/attachments/:attachmentId",
  { allow: canSeeServiceRequest, params: attachmentParamsSchema },
  (req, res, { params }) =>
    sendRequestAttachment(req.user!, params.requestId, params.attachmentId, appStorage(req), res),
);

serviceRequestRoutes.post(
  "/:requestId/estimates",
  {
    allow: canAnswerServiceRequest,
    params: serviceRequestParamsSchema,
    body: estimateInputSchema,
    response: serviceRequestDtoSchema,
  },
  async (req, res, { params, body }) => {
    await sendEstimate(req.user!, params.requestId, body, warningDays(req), linkBase(req));
    kick(req);
    res.status(201);
    return await viewRequest(req.user!, params.requestId);
  },
);

serviceRequestRoutes.put(
  "/:requestId/estimates/:estimateId",
  {
    allow: canAnswerServiceRequest,
    params: estimateParamsSchema,
    body: estimateInputSchema,
    response: serviceRequestDtoSchema,
  },
  async (req, _res, { params, body }) => {
    await reviseEstimate(
      req.user!,
      params.requestId,
      params.estimateId,
      body,
      warningDays(req),
      linkBase(req),
    );
    kick(req);
    return viewRequest(req.user!, params.requestId);
  },
);

serviceRequestRoutes.post(
  "/:requestId/estimates/:estimateId/withdraw",
  { allow: canAnswerServiceRequest, params: estimateParamsSchema, response: serviceRequestDtoSchema },
  async (req, _res, { params }) => {
    await withdrawEstimate(req.user!, params.requestId, params.estimateId, linkBase(req));
    kick(req);
    return viewRequest(req.user!, params.requestId);
  },
);

serviceRequestRoutes.post(
  "/:requestId/pass",
  {
    allow: canAnswerServiceRequest,
    params: serviceRequestParamsSchema,
    body: passSchema,
    response: serviceRequestDtoSchema,
  },
  async (req, _res, { params, body }) => {
    await passRequest(req.user!, params.requestId, body.reason);
    return viewRequest(req.user!, params.requestId);
  },
);

serviceRequestRoutes.post(
  "/:requestId/estimates/:estimateId/accept",
  { allow: canDecideServiceRequest, params: estimateParamsSchema, response: serviceRequestDtoSchema },
  async (req, _res, { params }) => {
    await acceptEstimate(req.user!, params.requestId, params.estimateId, warningDays(req), linkBase(req));
    kick(req);
    return viewRequest(req.user!, params.requestId);
  },
);

serviceRequestRoutes.post(
  "/:requestId/cancel",
  {
    allow: canDecideServiceRequest,
    params: serviceRequestParamsSchema,
    body: cancelRequestSchema,
    response: serviceRequestDtoSchema,
  },
  async (req, _res, { params, body }) => {
    await cancelRequest(req.user!, params.requestId, body.reason, linkBase(req));
    kick(req);
    return viewRequest(req.user!, params.requestId);
  },
);

serviceRequestRoutes.post(
  "/:requestId/follow-up",
  {
    allow: canFollowUp,
    params: serviceRequestParamsSchema,
    body: followUpNoteSchema,
    response: followUpLoggedDtoSchema,
  },
  (req, _res, { params, body }) => logFollowUp(req.user!, params.requestId, body.note),
);

serviceRequestRoutes.get(
  "/:requestId/threads/:companyId",
  { allow: canSeeThread, params: threadParamsSchema, response: z.array(requestMessageDtoSchema) },
  (req, _res, { params }) => listThread(req.user!, params.requestId, params.companyId),
);

// JSON or multipart (field `body`, optional part `file`), checked inside so a refused field still removes the upload.
serviceRequestRoutes.post(
  "/:requestId/threads/:companyId",
  {
    allow: canSeeThread,
    params: threadParamsSchema,
    before: [singleFileUpload],
    response: requestMessageDtoSchema,
    status: 201,
  },
  async (req, _res, { params }) => {
    try {
      const { body } = requestMessageSchema.parse(req.body ?? {});
      const dto = await postThreadMessage(
        req.user!,
        params.requestId,
        params.companyId,
        body,
        req.file,
        appStorage(req),
        linkBase(req),
      );
      kick(req);
      return dto;
    } finally {
      await removeUpload(req.file);
    }
  },
);

serviceRequestRoutes.get(
  "/:requestId/threads/:companyId/messages/:messageId/file",
  { allow: canSeeThread, params: threadFileParamsSchema },
  (req, res, { params }) =>
    sendThreadFile(req.user!, params.requestId, params.companyId, params.messageId, appStorage(req), res),
);
