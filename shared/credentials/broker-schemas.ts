import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { emailSchema } from "../accounts/schemas.ts";
import { idParam, typeCodeSchema } from "./schemas.ts";

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

export interface BrokerContactDto {
  id: number;
  typeCode: string | null;
  agency: string;
  contactName: string;
  email: string;
}

export interface BrokerRequestDto {
  id: number;
  typeCode: string;
  credentialId: number | null;
  shopCompanyId: number | null;
  agency: string;
  contactName: string;
  brokerEmail: string;
  expiresAt: string;
  usedAt: string | null;
  documentId: number | null;
  createdAt: string;
  coverageName: string;
  holderRole: HolderRole;
  origin: BrokerRequestOrigin;
  /** The shop to be named, by name, for the office's own list. */
  shopName: string | null;
  linkState: BrokerLinkState;
  reminders: { daysBefore: number; sentAt: string }[];
}

/** What the shop that asked sees of its request: no broker contact, no token, nothing of other shops. */
export interface ShopCertificateRequestDto {
  id: number;
  companyName: string;
  coverageName: string;
  holderRole: HolderRole;
  linkState: BrokerLinkState;
  createdAt: string;
  expiresAt: string;
  receivedAt: string | null;
  verifiedAt: string | null;
}

export interface ShopCertificateRequestsDto {
  requests: ShopCertificateRequestDto[];
  /** The service companies this shop works with (on its roster or in a work order), which it may ask. */
  companies: { id: number; name: string }[];
  coverages: { code: string; name: string }[];
}

/** One coverage on the office's broker screen: who its broker is, the policy on file, and every request for it. */
export interface BrokerCoverageDto {
  typeCode: string;
  coverageName: string;
  /** The broker a request for this coverage goes to: its own, else the company's, else none yet. */
  broker: { source: "coverage" | "company"; agency: string; contactName: string; email: string } | null;
  /** The latest policy on file for this coverage, if any (a request from here renews it). */
  coverage: { credentialId: number; state: string; lapsesAt: string | null } | null;
  requests: BrokerRequestDto[];
}

/** What the broker's page shows: only what the link was made for. */
export interface BrokerUploadPageDto {
  companyName: string;
  coverageName: string;
  certificateHolder: string | null;
  holderRole: HolderRole;
  expiresAt: string;
}
