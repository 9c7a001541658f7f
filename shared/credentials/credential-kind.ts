import type { CredentialState } from "./schemas.ts";

/** What decides whether two credentials are the same thing held by the same holder. */
export interface CredentialKindFields {
  typeCode: string;
  companyId: number;
  technicianId: number | null;
  fields: Record<string, unknown>;
}

// Builder training is held per builder and control family: a card on one control does not stand in for another.
const KIND_FIELDS: Record<string, readonly string[]> = { oem_training: ["builder", "controlFamily"] };

/** The fields beyond type and holder that tell two credentials of this type apart. */
export const kindFieldsOf = (typeCode: string): readonly string[] => KIND_FIELDS[typeCode] ?? [];

/**
 * Same type, same holder (and, for builder training, same builder and control family). A newly verified credential
 * replaces the verified one of the same kind, and a newer upload of the same kind answers a returned or lapsed one.
 */
export function sameCredentialKind(a: CredentialKindFields, b: CredentialKindFields): boolean {
  if (a.typeCode !== b.typeCode || a.companyId !== b.companyId || a.technicianId !== b.technicianId)
    return false;
  return kindFieldsOf(a.typeCode).every((key) => a.fields[key] === b.fields[key]);
}

export interface FollowUpCandidate extends CredentialKindFields {
  id: number;
  state: CredentialState;
  submittedAt: Date | string;
}

const submittedMs = (c: FollowUpCandidate) => new Date(c.submittedAt).getTime();

/**
 * Whether a returned or lapsed credential still waits for its holder: nothing newer of the same kind was sent since
 * (for a lapse, nothing newer that is verified or awaiting verification; a newer one that was itself returned leaves
 * the lapse open). Every other state waits for nobody.
 */
export function awaitsHolder(
  credential: FollowUpCandidate,
  sameCompany: readonly FollowUpCandidate[],
): boolean {
  if (credential.state !== "returned" && credential.state !== "lapsed") return false;
  const answers = (other: FollowUpCandidate) =>
    credential.state === "returned" || other.state === "verified" || other.state === "submitted";
  return !sameCompany.some(
    (other) =>
      other.id !== credential.id &&
      sameCredentialKind(other, credential) &&
      submittedMs(other) > submittedMs(credential) &&
      answers(other),
  );
}
