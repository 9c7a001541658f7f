import { z } from "zod";
import {
  credentialParamsSchema,
  credentialTypeParamsSchema,
  documentParamsSchema,
  editCredentialFieldsSchema,
  editCredentialTypeSchema,
  listCredentialsQuerySchema,
  queueQuerySchema,
  returnCredentialSchema,
  submitCoveragesSchema,
  submitCredentialSchema,
  uploadDocumentSchema,
  verifyCredentialSchema,
} from "../../shared/credentials/schemas.ts";
import {
  credentialDetailDtoSchema,
  credentialDtoSchema,
  credentialTypeDtoSchema,
  queuePageDtoSchema,
} from "../../shared/credentials/credential-shapes.ts";
import { createRoutes } from "../http/route.ts";
import { singleFileUpload } from "../http/upload.ts";
import { linkBase } from "../http/app-locals.ts";
import { appStorage } from "../storage/index.ts";
import { kickOutbox } from "../mail/outbox.ts";
import {
  canDownloadDocument,
  canEditCatalogue,
  canListOwnCredentials,
  canReadCatalogue,
  canReviewCredentials,
  canSubmitCoverages,
  canUploadDocuments,
  canViewCredential,
} from "./policy.ts";
import { editCredentialType, listCredentialTypes } from "./catalogue.ts";
import { uploadDocument } from "./upload-document.ts";
import { submitCredential } from "./submit-credential.ts";
import { submitCoverages } from "./submit-coverages.ts";
import { editCredentialFields, returnCredential, verifyCredential } from "./decide-credential.ts";
import { findCredential, findQueue, listOwnCredentials } from "./find-credentials.ts";
import { sendDocumentFile, sendPdfPage } from "./download-document.ts";
import {
  submittedCoveragesDtoSchema,
  uploadedDocumentDtoSchema,
} from "../../shared/credentials/credential-shapes.ts";

export const credentialRoutes = createRoutes("/api");

credentialRoutes.get(
  "/credential-types",
  { allow: canReadCatalogue, response: z.array(credentialTypeDtoSchema) },
  () => listCredentialTypes(),
);

credentialRoutes.patch(
  "/admin/credential-types/:code",
  {
    allow: canEditCatalogue,
    params: credentialTypeParamsSchema,
    body: editCredentialTypeSchema,
    response: credentialTypeDtoSchema,
  },
  (req, _res, { params, body }) => editCredentialType(req.user!, params.code, body),
);

credentialRoutes.post(
  "/documents",
  {
    allow: canUploadDocuments,
    before: [singleFileUpload],
    body: uploadDocumentSchema,
    response: uploadedDocumentDtoSchema,
    status: 201,
  },
  (req, _res, { body }) => uploadDocument(req.user!, body, req.file, appStorage(req)),
);

credentialRoutes.get(
  "/documents/:documentId/file",
  {
    allow: canDownloadDocument,
    params: documentParamsSchema,
    query: z.object({ inline: z.enum(["0", "1"]).optional() }),
  },
  (req, res, { params, query }) =>
    sendDocumentFile(req.user!, params.documentId, query.inline === "1", appStorage(req), res),
);

credentialRoutes.get(
  "/documents/:documentId/pages/:page",
  {
    allow: canDownloadDocument,
    params: documentParamsSchema.extend({ page: z.coerce.number().int().min(1).max(10) }),
  },
  (req, res, { params }) => sendPdfPage(req.user!, params.documentId, params.page, appStorage(req), res),
);

credentialRoutes.post(
  "/credentials",
  { allow: canUploadDocuments, body: submitCredentialSchema, response: credentialDtoSchema, status: 201 },
  (req, _res, { body }) => submitCredential(req.user!, body),
);

// Every coverage of one certificate in one request: all are saved, or none.
credentialRoutes.post(
  "/credentials/coverages",
  {
    allow: canSubmitCoverages,
    body: submitCoveragesSchema,
    response: submittedCoveragesDtoSchema,
    status: 201,
  },
  (req, _res, { body }) => submitCoverages(req.user!, body),
);

credentialRoutes.get(
  "/credentials",
  { allow: canListOwnCredentials, query: listCredentialsQuerySchema, response: z.array(credentialDtoSchema) },
  (req, _res, { query }) => listOwnCredentials(req.user!, query),
);

credentialRoutes.get(
  "/credentials/:credentialId",
  { allow: canViewCredential, params: credentialParamsSchema, response: credentialDetailDtoSchema },
  (req, _res, { params }) => findCredential(req.user!, params.credentialId),
);

credentialRoutes.post(
  "/credentials/:credentialId/verify",
  {
    allow: canReviewCredentials,
    params: credentialParamsSchema,
    body: verifyCredentialSchema,
    response: credentialDtoSchema,
  },
  async (req, _res, { params, body }) => {
    const dto = await verifyCredential(req.user!, params.credentialId, body, linkBase(req));
    kickOutbox(req.app.locals);
    return dto;
  },
);

credentialRoutes.post(
  "/credentials/:credentialId/return",
  {
    allow: canReviewCredentials,
    params: credentialParamsSchema,
    body: returnCredentialSchema,
    response: credentialDtoSchema,
  },
  async (req, _res, { params, body }) => {
    const dto = await returnCredential(req.user!, params.credentialId, body.reason, linkBase(req));
    kickOutbox(req.app.locals);
    return dto;
  },
);

credentialRoutes.patch(
  "/credentials/:credentialId/fields",
  {
    allow: canReviewCredentials,
    params: credentialParamsSchema,
    body: editCredentialFieldsSchema,
    response: credentialDtoSchema,
  },
  (req, _res, { params, body }) => editCredentialFields(req.user!, params.credentialId, body.fields),
);

credentialRoutes.get(
  "/review/queue",
  { allow: canReviewCredentials, query: queueQuerySchema, response: queuePageDtoSchema },
  (_req, _res, { query }) => findQueue(query),
);
