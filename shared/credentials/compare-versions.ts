/** One field that differs between the verified version on file and the one under review. */
export interface FieldChange {
  /** Path inside the credential's fields, e.g. "expirationDate" or "limits.eachOccurrence". */
  path: string;
  before: FieldValue;
  after: FieldValue;
}

export type FieldValue = string | number | boolean | null;

// Order in which a reviewer reads a change: who insures, which policy, when, how much, then everything else.
const READING_ORDER = [
  "insurerName",
  "naic",
  "policyNumber",
  "effectiveDate",
  "expirationDate",
  "issueDate",
  "expiryDate",
  "limits.",
];

function rank(path: string): number {
  const i = READING_ORDER.findIndex((p) => (p.endsWith(".") ? path.startsWith(p) : path === p));
  return i === -1 ? READING_ORDER.length : i;
}

function flatten(value: unknown, prefix: string, into: Map<string, FieldValue>): void {
  if (value === undefined || value === null) return;
  if (Array.isArray(value)) {
    if (value.length > 0) into.set(prefix, value.map(String).join(", "));
    return;
  }
  if (typeof value === "object") {
    for (const [key, inner] of Object.entries(value as Record<string, unknown>))
      flatten(inner, prefix ? `${prefix}.${key}` : key, into);
    return;
  }
  if (typeof value === "string") {
    const trimmed = value.trim().replace(/\s+/g, " ");
    if (trimmed !== "") into.set(prefix, trimmed);
    return;
  }
  if (typeof value === "number" || typeof value === "boolean") into.set(prefix, value);
}

/**
 * What changed from one version of a policy or card to the next: every field present in either whose value differs,
 * an absent field read as null. Whitespace alone is no change (a re-typed name); letter case is, since an insurer's
 * legal name is printed exactly. A false flag and a missing flag are the same (the form stores unticked as false).
 */
export function compareCredentialFields(previous: unknown, current: unknown): FieldChange[] {
  const before = new Map<string, FieldValue>();
  const after = new Map<string, FieldValue>();
  flatten(previous, "", before);
  flatten(current, "", after);
  const paths = [...new Set([...before.keys(), ...after.keys()])];
  const changes: FieldChange[] = [];
  for (const path of paths) {
    const b = before.get(path) ?? null;
    const a = after.get(path) ?? null;
    if (b === a) continue;
    if ((b === null || b === false) && (a === null || a === false)) continue;
    changes.push({ path, before: b, after: a });
  }
  return changes.sort((x, y) => rank(x.path) - rank(y.path) || x.path.localeCompare(y.path));
}
