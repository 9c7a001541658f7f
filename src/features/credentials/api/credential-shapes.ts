import { z } from "zod";
import { credentialCategories, credentialHolders } from "@shared/credentials/catalogue.ts";
import { fieldSets } from "@shared/credentials/credential-fields.ts";
import { credentialStates } from "@shared/credentials/schemas.ts";

// The wire shapes the credentials API answers with. shared/ declares them as interfaces; these check them at run time.

export const credentialTypeSchema = z.object({
  code: z.string(),
  name: z.string(),
  category: z.enum(credentialCategories),
  holder: z.enum(credentialHolders),
  fieldSet: z.enum(fieldSets),
  validity: z.union([
    z.object({ kind: z.literal("document_dates") }),
    z.object({ kind: z.literal("months_from_issue"), months: z.number() }),
    z.object({ kind: z.literal("no_expiry") }),
  ]),
  description: z.string(),
  caution: z.string().nullable(),
  active: z.boolean(),
});
export type CredentialType = z.infer<typeof credentialTypeSchema>;

export const reviewerWarningSchema = z.object({ code: z.string(), message: z.string() });
export type ReviewerWarningView = z.infer<typeof reviewerWarningSchema>;

export const fieldEvidenceSchema = z.object({
  confidence: z.number(),
  box: z.object({ page: z.number(), x: z.number(), y: z.number(), w: z.number(), h: z.number() }).optional(),
});
export const evidenceSchema = z.record(z.string(), fieldEvidenceSchema).default({});
export type FieldEvidenceView = z.infer<typeof fieldEvidenceSchema>;

export const credentialSchema = z.object({
  id: z.number(),
  typeCode: z.string(),
  typeName: z.string(),
  category: z.string(),
  holder: z.enum(credentialHolders),
  companyId: z.number(),
  companyName: z.string(),
  technicianId: z.number().nullable(),
  technicianName: z.string().nullable(),
  documentId: z.number(),
  documentName: z.string(),
  documentMime: z.string(),
  state: z.enum(credentialStates),
  fields: z.record(z.string(), z.unknown()),
  returnReason: z.string().nullable(),
  submittedAt: z.string(),
  decidedAt: z.string().nullable(),
  lapsesAt: z.string().nullable(),
  awaitsHolder: z.boolean(),
});
export type Credential = z.infer<typeof credentialSchema>;

export const auditEventSchema = z.object({
  id: z.number(),
  action: z.string(),
  actorName: z.string().nullable(),
  at: z.string(),
  before: z.unknown(),
  after: z.unknown(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

export const sameDocumentRowSchema = z.object({
  id: z.number(),
  typeCode: z.string(),
  typeName: z.string(),
  state: z.enum(credentialStates),
});

const fieldValueSchema = z.union([z.string(), z.number(), z.boolean()]).nullable();

export const previousVersionSchema = z.object({
  id: z.number(),
  state: z.enum(["verified", "superseded", "lapsed"]),
  decidedAt: z.string().nullable(),
  changes: z.array(z.object({ path: z.string(), before: fieldValueSchema, after: fieldValueSchema })),
});
export type PreviousVersion = z.infer<typeof previousVersionSchema>;

export const credentialDetailSchema = credentialSchema.extend({
  audit: z.array(auditEventSchema).default([]),
  warnings: z.array(reviewerWarningSchema).default([]),
  /** Every credential sent from the same file (the coverages of one certificate), this one included. */
  sameDocument: z.array(sameDocumentRowSchema).default([]),
  /** Where each field was read on the page and how sure the reader was. */
  evidence: evidenceSchema,
  /** The verified version of the same policy or card before this one, and what changed since (reviewers only). */
  previousVersion: previousVersionSchema.nullable().default(null),
});
export type CredentialDetail = z.infer<typeof credentialDetailSchema>;

export const queueRowSchema = z.object({
  id: z.number(),
  typeCode: z.string(),
  typeName: z.string(),
  companyId: z.number(),
  companyName: z.string(),
  holderName: z.string(),
  submittedAt: z.string(),
  waitingHours: z.number(),
});
export type QueueRow = z.infer<typeof queueRowSchema>;

export const queuePageSchema = z.object({
  rows: z.array(queueRowSchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
});
export type QueuePage = z.infer<typeof queuePageSchema>;

export const proposedCoverageSchema = z.object({
  typeCode: z.string(),
  typeName: z.string(),
  fields: z.record(z.string(), z.unknown()).default({}),
  found: z.array(z.string()).default([]),
  evidence: evidenceSchema,
  warnings: z.array(reviewerWarningSchema).default([]),
});
export type ProposedCoverage = z.infer<typeof proposedCoverageSchema>;

export const uploadedDocumentSchema = z.object({
  document: z.object({
    id: z.number(),
    name: z.string(),
    mime: z.string(),
    sizeBytes: z.number(),
    sha256: z.string(),
  }),
  extraction: z.object({
    method: z.enum(["pdf_text", "ocr", "none"]),
    ocrAvailable: z.boolean(),
    fields: z.record(z.string(), z.unknown()).default({}),
    found: z.array(z.string()).default([]),
    evidence: evidenceSchema,
  }),
  warnings: z.array(reviewerWarningSchema).default([]),
  certificate: z
    .object({
      parties: z.record(z.string(), z.string()).default({}),
      coverages: z.array(proposedCoverageSchema),
    })
    .nullable()
    .default(null),
});
export type UploadedDocument = z.infer<typeof uploadedDocumentSchema>;
