import type { CredentialState } from "../credentials/schemas.ts";
import { MS_PER_DAY } from "./warning-windows.ts";

interface Lapsing {
  state: CredentialState;
  lapsesAt: string | null;
}

/**
 * Credentials that count today and stop counting within `days`, soonest first. Only a verified credential counts, as
 * in the standing engine: one awaiting verification leaves its requirement unmet, so it cannot "lapse" from met.
 */
export function lapsingSoon<T extends Lapsing>(credentials: readonly T[], asOf: Date, days: number): T[] {
  const from = asOf.getTime();
  const until = from + days * MS_PER_DAY;
  return credentials
    .filter((c) => c.state === "verified" && c.lapsesAt !== null)
    .filter((c) => {
      const at = new Date(c.lapsesAt!).getTime();
      return at > from && at <= until;
    })
    .sort((a, b) => a.lapsesAt!.localeCompare(b.lapsesAt!));
}
