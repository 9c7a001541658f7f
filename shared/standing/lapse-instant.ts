import type { CredentialTypeDefinition } from "../credentials/catalogue.ts";
import type { CredentialFields, InsuranceFields } from "../credentials/credential-fields.ts";
import { policyEndInstant, policyStartInstant } from "./policy-period.ts";
import { startOfDateInstant, trainingLapseInstant } from "./training-validity.ts";

function insuranceDates(type: CredentialTypeDefinition, fields: CredentialFields): InsuranceFields {
  if (!("expirationDate" in fields) || !("effectiveDate" in fields)) {
    throw new TypeError(`Credential of type ${type.code} lacks its policy dates`);
  }
  return fields;
}

function issueDates(
  type: CredentialTypeDefinition,
  fields: CredentialFields,
): { issueDate: string; expiryDate?: string | undefined } {
  if (!("issueDate" in fields)) throw new TypeError(`Credential of type ${type.code} lacks its issue date`);
  return fields;
}

/**
 * The first instant a credential no longer counts, or null when it never lapses by the calendar.
 * Insurance: 12:01 a.m. standard time on the expiration date at the insured's address (ISO CG DS 01 wording, from memory).
 * Everything else: the start of the day after its valid-through date in the holder's zone (training-validity.ts).
 */
export function credentialLapseInstant(
  type: CredentialTypeDefinition,
  fields: CredentialFields,
  timeZone: string,
): Date | null {
  if (type.fieldSet === "insurance")
    return policyEndInstant(insuranceDates(type, fields).expirationDate, timeZone);
  return trainingLapseInstant(type.validity, issueDates(type, fields), timeZone);
}

/** The first instant a credential counts: a policy from its effective date's 12:01 a.m. standard time, a card from its issue date. */
export function credentialStartInstant(
  type: CredentialTypeDefinition,
  fields: CredentialFields,
  timeZone: string,
): Date {
  if (type.fieldSet === "insurance")
    return policyStartInstant(insuranceDates(type, fields).effectiveDate, timeZone);
  return startOfDateInstant(issueDates(type, fields).issueDate, timeZone);
}
