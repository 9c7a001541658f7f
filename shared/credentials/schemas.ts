import { z } from "zod";
import { singleLineText, multiLineText } from "../api/text.ts";

export const credentialStates = ["submitted", "verified", "returned", "superseded", "lapsed"] as const;
export type CredentialState = (typeof credentialStates)[number];

export const idParam = z.coerce.number().int().positive().max(2_147_483_647);

export const credentialParamsSchema = z.object({ credentialId: idParam });
export const documentParamsSchema = z.object({ documentId: idParam });
export const typeCodeSchema = singleLineText().regex(/^[a-z][a-z0-9_]{1,39}$/, "Unknown credential type");

/** The multipart fields sent with an uploaded file. */
export const uploadDocumentSchema = z.object({
  typeCode: typeCodeSchema,
  technicianId: idParam.optional(),
});
export type UploadDocument = z.infer<typeof uploadDocumentSchema>;

/** Fields are checked against the type's own field schema by the service (it knows the type's field set). */
export const submitCredentialSchema = z.object({
  documentId: idParam,
  typeCode: typeCodeSchema,
  technicianId: idParam.optional(),
  fields: z.record(singleLineText(), z.unknown()),
});
export type SubmitCredential = z.infer<typeof submitCredentialSchema>;

/** Every coverage read from one certificate of insurance, confirmed by the uploader and sent together. */
export const submitCoveragesSchema = z.object({
  documentId: idParam,
  credentials: z
    .array(z.object({ typeCode: typeCodeSchema, fields: z.record(singleLineText(), z.unknown()) }))
    .min(1, "Keep at least one coverage")
    // A certificate lists a handful of coverage lines; more would be a client bug, not a certificate.
    .max(12, "At most 12 coverages at once")
    .refine(
      (list) => new Set(list.map((c) => c.typeCode)).size === list.length,
      "Each coverage may be sent once per certificate",
    ),
});
export type SubmitCoverages = z.infer<typeof submitCoveragesSchema>;

export const returnCredentialSchema = z.object({
  reason: multiLineText().trim().min(5, "Say what the uploader must fix (at least 5 characters)").max(1000),
});
export type ReturnCredential = z.infer<typeof returnCredentialSchema>;

export const verifyCredentialSchema = z.object({
  fields: z.record(singleLineText(), z.unknown()).optional(),
});
export type VerifyCredential = z.infer<typeof verifyCredentialSchema>;

export const editCredentialFieldsSchema = z.object({
  fields: z.record(singleLineText(), z.unknown()),
});

export const listCredentialsQuerySchema = z.object({
  technicianId: idParam.optional(),
  state: z.enum(credentialStates).optional(),
  holder: z.enum(["company", "technician"]).optional(),
});

export const queueSortKeys = ["submittedAt", "typeCode", "companyName"] as const;
export const queueQuerySchema = z.object({
  typeCode: typeCodeSchema.optional(),
  companyId: idParam.optional(),
  minWaitingHours: z.coerce
    .number()
    .min(0)
    .max(24 * 365)
    .optional(),
  sort: z.enum(queueSortKeys).default("submittedAt"),
  dir: z.enum(["asc", "desc"]).default("asc"),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});
export type QueueQuery = z.infer<typeof queueQuerySchema>;

export const editCredentialTypeSchema = z.object({
  name: singleLineText().trim().min(3).max(160).optional(),
  description: multiLineText().trim().min(3).max(2000).optional(),
  active: z.boolean().optional(),
  validityMonths: z.number().int().min(1).max(120).optional(),
});
export const credentialTypeParamsSchema = z.object({ code: typeCodeSchema });
