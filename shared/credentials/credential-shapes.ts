import { z } from "zod";
import { credentialCategories, credentialHolders } from "./catalogue.ts";
import { fieldSets } from "./credential-fields.ts";
import { reviewerWarningCodes } from "./reviewer-checks.ts";
import { credentialStates } from "./schemas.ts";

// Response shapes of the credentials API: the server's DTO types are inferred from these and the client parses its
// answers with them.

/**
 * A credential's fields differ by its type's field set and are checked against that set by the service when they come
 * in (shared/credentials/credential-fields.ts), so the answer carries them as an open record.
 */
const credentialFieldsSchema = z.record(z.string(), z.unknown());

export const credentialTypeDtoSchema = z.object({
  code: z.string(),
  name: z.string(),
  category: z.enum(credentialCategories),
  holder: z.enum(credentialHolders),
  fieldSet: z.enum(fieldSets),
  validity: z.discriminatedUnion("kind", [
    z.object({ kind: z.literal("document_dates") }),
    z.object({ kind: z.literal("months_from_issue"), months: z.number() }),
    z.object({ kind: z.literal("no_expiry") }),
  ]),
  description: z.string(),
  caution: z.string().nullable(),
  active: z.boolean(),
});
export type CredentialTypeDto = z.infer<typeof credentialTypeDtoSchema>;

export const reviewerWarningDtoSchema = z.object({ code: z.enum(reviewerWarningCodes), message: z.string() });
export type ReviewerWarningDto = z.infer<typeof reviewerWarningDtoSchema>;

/** Where one field was read on the page and how sure the reader was (shared/credentials/locate-values.ts). */
export const fieldEvidenceDtoSchema = z.object({
  confidence: z.number(),
  box: z.object({ page: z.number(), x: z.number(), y: z.number(), w: z.number(), h: z.number() }).optional(),
});
export const evidenceDtoSchema = z.record(z.string(), fieldEvidenceDtoSchema);

export const credentialDtoSchema = z.object({
  id: z.number(),
  typeCode: z.string(),
  typeName: z.string(),
  category: z.enum(credentialCategories),
  holder: z.enum(credentialHolders),
  companyId: z.number(),
  companyName: z.string(),
  technicianId: z.number().nullable(),
  technicianName: z.string().nullable(),
  documentId: z.number(),
  documentName: z.string(),
  documentMime: z.string(),
  state: z.enum(credentialStates),
  fields: credentialFieldsSchema,
  returnReason: z.string().nullable(),
  submittedAt: z.string(),
  decidedAt: z.string().nullable(),
  lapsesAt: z.string().nullable(),
  /** A returned or lapsed credential that nothing newer of the same kind has answered yet. */
  awaitsHolder: z.boolean(),
});
export type CredentialDto = z.infer<typeof credentialDtoSchema>;

export const auditEventDtoSchema = z.object({
  id: z.number(),
  action: z.string(),
  actorName: z.string().nullable(),
  at: z.string(),
  // The row as it was before and after the action: a snapshot of whatever the action changed.
  before: z.unknown(),
  after: z.unknown(),
});
export type AuditEventDto = z.infer<typeof auditEventDtoSchema>;

export const sameDocumentRowDtoSchema = z.object({
  id: z.number(),
  typeCode: z.string(),
  typeName: z.string(),
  state: z.enum(credentialStates),
});

const fieldValueSchema = z.union([z.string(), z.number(), z.boolean()]).nullable();

/** The verified version of the same policy or card before this one, and what changed since. */
export const previousVersionDtoSchema = z.object({
  id: z.number(),
  state: z.enum(["verified", "superseded", "lapsed"]),
  decidedAt: z.string().nullable(),
  changes: z.array(z.object({ path: z.string(), before: fieldValueSchema, after: fieldValueSchema })),
});
export type PreviousVersionDto = z.infer<typeof previousVersionDtoSchema>;

/** One credential with its trail; warnings, evidence and the previous version are filled for reviewers only. */
export const credentialDetailDtoSchema = credentialDtoSchema.extend({
  audit: z.array(auditEventDtoSchema),
  warnings: z.array(reviewerWarningDtoSchema),
  /** Every credential sent from the same file (the coverages of one certificate), this one included. */
  sameDocument: z.array(sameDocumentRowDtoSchema),
  evidence: evidenceDtoSchema,
  previousVersion: previousVersionDtoSchema.nullable(),
});
export type CredentialDetailDto = z.infer<typeof credentialDetailDtoSchema>;

export const queueRowDtoSchema = z.object({
  id: z.number(),
  typeCode: z.string(),
  typeName: z.string(),
  companyId: z.number(),
  companyName: z.string(),
  holderName: z.string(),
  submittedAt: z.string(),
  waitingHours: z.number(),
});
export type QueueRowDto = z.infer<typeof queueRowDtoSchema>;

export const queuePageDtoSchema = z.object({
  rows: z.array(queueRowDtoSchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
});
export type QueuePageDto = z.infer<typeof queuePageDtoSchema>;

export const submittedCoveragesDtoSchema = z.object({ credentials: z.array(credentialDtoSchema) });

/** What was read from an uploaded file for one type: proposed fields, which were found, and where. */
const proposalDtoSchema = z.object({
  fields: credentialFieldsSchema,
  found: z.array(z.string()),
  evidence: evidenceDtoSchema,
});

export const proposedCoverageDtoSchema = proposalDtoSchema.extend({
  typeCode: z.string(),
  typeName: z.string(),
  warnings: z.array(reviewerWarningDtoSchema),
});
export type ProposedCoverageDto = z.infer<typeof proposedCoverageDtoSchema>;

/** The stored document, what was read from it, the reviewer's warnings, and for a certificate every coverage it lists. */
export const uploadedDocumentDtoSchema = z.object({
  document: z.object({
    id: z.number(),
    name: z.string(),
    mime: z.string(),
    sizeBytes: z.number(),
    sha256: z.string(),
  }),
  extraction: proposalDtoSchema.extend({
    method: z.enum(["pdf_text", "ocr", "none"]),
    ocrAvailable: z.boolean(),
  }),
  warnings: z.array(reviewerWarningDtoSchema),
  certificate: z
    .object({
      parties: z.object({
        producer: z.string().optional(),
        namedInsured: z.string().optional(),
        certificateHolder: z.string().optional(),
      }),
      coverages: z.array(proposedCoverageDtoSchema),
    })
    .nullable(),
});
export type UploadedDocumentDto = z.infer<typeof uploadedDocumentDtoSchema>;
