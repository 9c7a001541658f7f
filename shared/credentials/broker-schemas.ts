import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { emailSchema } from "../accounts/schemas.ts";
import { idParam, typeCodeSchema } from "./schemas.ts";

/** How long a broker's upload link works: two weeks covers a renewal turned round by an agency (common practice). */
export const BROKER_LINK_DAYS = 14;

/** Days before a lapse at which the broker is reminded, if nothing has arrived (common practice: 30, 14, 7). */
export const BROKER_REMINDER_DAYS = [30, 14, 7] as const;

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
  })
  .refine((b) => b.credentialId !== undefined || b.typeCode !== undefined, {
    message: "Name the coverage (credentialId) or its type (typeCode)",
    path: ["typeCode"],
  });
export type RequestBrokerCertificate = z.infer<typeof requestBrokerCertificateSchema>;

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
}

/** What the broker's page shows: only what the link was made for. */
export interface BrokerUploadPageDto {
  companyName: string;
  coverageName: string;
  certificateHolder: string | null;
  expiresAt: string;
}
