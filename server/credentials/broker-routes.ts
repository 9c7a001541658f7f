import type { RequestHandler } from "express";
import { z } from "zod";
import { typeCodeSchema } from "../../shared/credentials/schemas.ts";
import {
  askForCertificateSchema,
  brokerContactDtoSchema,
  brokerCoverageDtoSchema,
  brokerRequestDtoSchema,
  brokerTokenParamsSchema,
  brokerUploadPageDtoSchema,
  shopCertificateRequestsDtoSchema,
  requestBrokerCertificateSchema,
  saveBrokerContactSchema,
} from "../../shared/credentials/broker-schemas.ts";
import { createRoutes } from "../http/route.ts";
import { AppError } from "../http/app-error.ts";
import { anyone, requireRole } from "../http/policy.ts";
import { singleFileUpload } from "../http/upload.ts";
import { linkBase } from "../http/app-locals.ts";
import { appStorage } from "../storage/index.ts";
import { kickOutbox } from "../mail/outbox.ts";
import { abuseLimit } from "../accounts/abuse-limits.ts";
import {
  listBrokerContacts,
  listBrokerRequests,
  removeCoverageBroker,
  openBrokerRequest,
  receiveBrokerUpload,
  requestBrokerCertificate,
  saveBrokerContact,
  showBrokerUpload,
} from "./broker-requests.ts";
import { listBrokerCoverages } from "./broker-coverages.ts";
import { askForCertificate, listShopCertificateRequests } from "./shop-certificate-requests.ts";
import {
  brokerUploadReceivedDtoSchema,
  shopCertificateRequestDtoSchema,
} from "../../shared/credentials/broker-schemas.ts";

// A company's insurance is handled by its office; the broker's own routes need no account, only the link.
const canManageBroker = requireRole("provider_admin");
const brokerLinkHolder = { ...anyone, name: "anyone holding an upload link" };

/** Refuses a bad, spent or expired link before its input is read, and before multer writes any of a file to disk. */
const linkStillOpen: RequestHandler = (req, _res, next) => {
  const parsed = brokerTokenParamsSchema.safeParse(req.params);
  if (!parsed.success) return next(new AppError("not_found", "This link was not found"));
  openBrokerRequest(parsed.data.token).then(() => next(), next);
};

export const brokerRoutes = createRoutes("/api");

brokerRoutes.get(
  "/broker-contacts",
  { allow: canManageBroker, response: z.array(brokerContactDtoSchema) },
  (req) => listBrokerContacts(req.user!),
);

brokerRoutes.put(
  "/broker-contacts",
  { allow: canManageBroker, body: saveBrokerContactSchema, response: brokerContactDtoSchema },
  (req, _res, { body }) => saveBrokerContact(req.user!, body),
);

brokerRoutes.delete(
  "/broker-contacts/:typeCode",
  { allow: canManageBroker, params: z.object({ typeCode: typeCodeSchema }) },
  (req, _res, { params }) => removeCoverageBroker(req.user!, params.typeCode),
);

brokerRoutes.get(
  "/broker-requests",
  { allow: canManageBroker, response: z.array(brokerRequestDtoSchema) },
  (req) => listBrokerRequests(req.user!),
);

brokerRoutes.get(
  "/broker-coverages",
  { allow: canManageBroker, response: z.array(brokerCoverageDtoSchema) },
  (req) => listBrokerCoverages(req.user!),
);

brokerRoutes.post(
  "/broker-requests",
  { allow: canManageBroker, body: requestBrokerCertificateSchema, response: brokerRequestDtoSchema },
  async (req, res, { body }) => {
    const dto = await requestBrokerCertificate(req.user!, body, linkBase(req));
    kickOutbox(req.app.locals);
    res.status(201);
    return dto;
  },
);

brokerRoutes.get(
  "/broker-uploads/:token",
  {
    allow: brokerLinkHolder,
    before: [abuseLimit("brokerLink"), linkStillOpen],
    params: brokerTokenParamsSchema,
    response: brokerUploadPageDtoSchema,
  },
  (_req, _res, { params }) => showBrokerUpload(params.token),
);

brokerRoutes.post(
  "/broker-uploads/:token",
  {
    allow: brokerLinkHolder,
    before: [abuseLimit("brokerLink"), linkStillOpen, singleFileUpload],
    params: brokerTokenParamsSchema,
    response: brokerUploadReceivedDtoSchema,
    status: 201,
  },
  (req, _res, { params }) => receiveBrokerUpload(params.token, req.file, appStorage(req)),
);

// A shop asks through the platform; it never sees the broker's contact or the link, only how its request stands.
const canAskForCertificate = requireRole("buyer");

brokerRoutes.get(
  "/certificate-requests",
  { allow: canAskForCertificate, response: shopCertificateRequestsDtoSchema },
  (req) => listShopCertificateRequests(req.user!),
);

brokerRoutes.post(
  "/certificate-requests",
  { allow: canAskForCertificate, body: askForCertificateSchema, response: shopCertificateRequestDtoSchema },
  async (req, res, { body }) => {
    const dto = await askForCertificate(req.user!, body, linkBase(req));
    kickOutbox(req.app.locals);
    res.status(201);
    return dto;
  },
);
