import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { emailSchema } from "../accounts/schemas.ts";
import { idParam, typeCodeSchema } from "./schemas.ts";
import { credentialStates } from "../standing/standing-types.ts";

/** How long a broker's upload link works: two weeks covers a renewal turned round by an agency (common practice). */
export const BROKER_LINK_DAYS = 14;

/** Days before a lapse at which the broker is reminded, if nothing has arrived (common practice: 30, 14, 7). */
export const BROKER_REMINDER_DAYS = [30, 14, 7] as const;

/**
 * How a shop asks to be named on a certificate of insurance. A certificate holder is only told of the coverage; an
 * additional insured is covered by the policy itself, which takes an endorsement only the insurer issues; the
 * certificate merely reports it (ACORD 25 instructions, common practice).
 */
export const holderRoles = ["certificate_holder", "additional_insured"] as const;
export type HolderRole = (typeof holderRoles)[number];
export const holderRoleLabels: Record<HolderRole, string> = {
  certificate_holder: "Certificate holder",
  additional_insured: "Certificate holder and additional insured",
};

export const brokerRequestOrigins = ["office", "shop"] as const;
export type BrokerRequestOrigin = (typeof brokerRequestOrigins)[number];

/** Where a link stands: sent and still open, used once (the certificate came), or run out unused. */
export const brokerLinkStates = ["sent", "used", "expired"] as const;
export type BrokerLinkState = (typeof brokerLinkStates)[number];

export function brokerLinkState(r: { usedAt: Date | null; expiresAt: Date }, asOf: Date): BrokerLinkState {
  if (r.usedAt) return "used";
  return r.expiresAt <= asOf ? "expired" : "sent";
}

export const saveBrokerContactSchema = z.object({
  /** Null or absent: the broker for every coverage; a type code: that coverage's own broker. */
  typeCode: typeCodeSchema.nullable().optional(),
  agency: singleLineText().trim().min(1, "Enter the agency").max(160),
  contactName: singleLineText().trim().min(1, "Enter the contact's name").max(160),
  email: emailSchema,
});
export type SaveBrokerContact = z.infer<typeof saveBrokerContactSchema>;

export const requestBrokerCertificateSchema = z
  .object({
    /** The lapsing coverage to renew. */
    credentialId: idParam.optional(),
    /** Or the coverage wanted, when none is on file yet. */
    typeCode: typeCodeSchema.optional(),
    /** The shop to be named as certificate holder. */
    shopCompanyId: idParam.optional(),
    holderRole: z.enum(holderRoles).optional(),
  })
  .refine((b) => b.credentialId !== undefined || b.typeCode !== undefined, {
    message: "Name the coverage (credentialId) or its type (typeCode)",
    path: ["typeCode"],
  });
export type RequestBrokerCertificate = z.infer<typeof requestBrokerCertificateSchema>;

/** A shop asking a service company, through the platform, for a certificate that names the shop. */
export const askForCertificateSchema = z.object({
  serviceCompanyId: idParam,
  typeCode: typeCodeSchema,
  holderRole: z.enum(holderRoles),
});
export type AskForCertificate = z.infer<typeof askForCertificateSchema>;

// Tokens are base64url. The route checks the link before this schema, so a malformed token answers 404 like an unknown
// one, with nothing to tell a guesser.
export const brokerTokenParamsSchema = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{1,100}$/) });

// Response shapes: the server's DTO types are inferred from these and the client parses its answers with them.

export const brokerContactDtoSchema = z.object({
  id: z.number(),
  /** Null: the broker for every coverage. */
  typeCode: z.string().nullable(),
  agency: z.string(),
  contactName: z.string(),
  email: z.string(),
});
export type BrokerContactDto = z.infer<typeof brokerContactDtoSchema>;

export const brokerRequestDtoSchema = z.object({
  id: z.number(),
  typeCode: z.string(),
  credentialId: z.number().nullable(),
  shopCompanyId: z.number().nullable(),
  agency: z.string(),
  contactName: z.string(),
  brokerEmail: z.string(),
  expiresAt: z.string(),
  usedAt: z.string().nullable(),
  documentId: z.number().nullable(),
  createdAt: z.string(),
  coverageName: z.string(),
  holderRole: z.enum(holderRoles),
  origin: z.enum(brokerRequestOrigins),
  /** The shop to be named, by name, for the office's own list. */
  shopName: z.string().nullable(),
  linkState: z.enum(brokerLinkStates),
  reminders: z.array(z.object({ daysBefore: z.number(), sentAt: z.string() })),
});
export type BrokerRequestDto = z.infer<typeof brokerRequestDtoSchema>;

/** What the shop that asked sees of its request: no broker contact, no token, nothing of other shops. */
export const shopCertificateRequestDtoSchema = z.object({
  id: z.number(),
  companyName: z.string(),
  coverageName: z.string(),
  holderRole: z.enum(holderRoles),
  linkState: z.enum(brokerLinkStates),
  createdAt: z.string(),
  expiresAt: z.string(),
  receivedAt: z.string().nullable(),
  verifiedAt: z.string().nullable(),
});
export type ShopCertificateRequestDto = z.infer<typeof shopCertificateRequestDtoSchema>;

export const shopCertificateRequestsDtoSchema = z.object({
  requests: z.array(shopCertificateRequestDtoSchema),
  /** The service companies this shop works with (on its roster or in a work order), which it may ask. */
  companies: z.array(z.object({ id: z.number(), name: z.string() })),
  coverages: z.array(z.object({ code: z.string(), name: z.string() })),
});
export type ShopCertificateRequestsDto = z.infer<typeof shopCertificateRequestsDtoSchema>;

/** One coverage on the office's broker screen: who its broker is, the policy on file, and every request for it. */
export const brokerCoverageDtoSchema = z.object({
  typeCode: z.string(),
  coverageName: z.string(),
  /** The broker a request for this coverage goes to: its own, else the company's, else none yet. */
  broker: brokerContactDtoSchema
    .omit({ id: true, typeCode: true })
    .extend({ source: z.enum(["coverage", "company"]) })
    .nullable(),
  /** The latest policy on file for this coverage, if any (a request from here renews it). */
  coverage: z
    .object({ credentialId: z.number(), state: z.enum(credentialStates), lapsesAt: z.string().nullable() })
    .nullable(),
  requests: z.array(brokerRequestDtoSchema),
});
export type BrokerCoverageDto = z.infer<typeof brokerCoverageDtoSchema>;

/** What the broker's page shows: only what the link was made for. */
export const brokerUploadPageDtoSchema = z.object({
  companyName: z.string(),
  coverageName: z.string(),
  certificateHolder: z.string().nullable(),
  holderRole: z.enum(holderRoles),
  expiresAt: z.string(),
});
export type BrokerUploadPageDto = z.infer<typeof brokerUploadPageDtoSchema>;

/** The broker's one upload, received: the file's name and size, nothing of where it went. */
export const brokerUploadReceivedDtoSchema = z.object({
  received: z.literal(true),
  document: z.object({ name: z.string(), sizeBytes: z.number() }),
});
