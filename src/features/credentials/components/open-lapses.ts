import type { Credential } from "../api/credential-shapes.ts";

/** Lapsed credentials with nothing newer of the same type and holder verified or awaiting verification since. */
export const openLapses = (credentials: readonly Credential[]): Credential[] =>
  credentials.filter(
    (c) =>
      c.state === "lapsed" &&
      !credentials.some(
        (other) =>
          other.id !== c.id &&
          other.typeCode === c.typeCode &&
          other.technicianId === c.technicianId &&
          (other.state === "verified" || other.state === "submitted") &&
          other.submittedAt > c.submittedAt,
      ),
  );
