import type { Credential } from "../api/credential-shapes.ts";

const sameHolderAndType = (a: Credential, b: Credential) =>
  a.typeCode === b.typeCode && a.technicianId === b.technicianId;

/** Returned credentials not yet answered: no newer one of the same type and holder was submitted since. */
export const openReturns = (credentials: readonly Credential[]): Credential[] =>
  credentials.filter(
    (c) =>
      c.state === "returned" &&
      !credentials.some(
        (other) => other.id !== c.id && sameHolderAndType(other, c) && other.submittedAt > c.submittedAt,
      ),
  );
