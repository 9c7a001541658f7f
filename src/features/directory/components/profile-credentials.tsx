import { credentialTypeByCode } from "@shared/credentials/catalogue.ts";
import type { LimitName } from "@shared/credentials/credential-fields.ts";
import { LIMIT_LABELS } from "@shared/credentials/limit-lines.ts";
import { lapseWords, readerTimeZone } from "@shared/standing/lapse-words.ts";
import { formatIsoDate } from "@/lib/format-date.ts";
import { formatDollars } from "@/lib/format-money.ts";
import type { ProfileCredentialDto as ProfileCredential } from "@shared/directory/directory-shapes.ts";

const text = (v: unknown): string | null => (typeof v === "string" && v.trim() ? v : null);

/** The facts a buyer checks, in words: who insures, the dates, the limits and the endorsements, or the training details. */
function factsOf(fields: Record<string, unknown>): [string, string][] {
  const facts: [string, string][] = [];
  const add = (label: string, value: string | null) => value && facts.push([label, value]);
  add("Insurer", text(fields.insurerName));
  add("Policy", text(fields.policyNumber));
  add("Course", text(fields.course));
  add("Machine builder", text(fields.builder));
  add("Control family", text(fields.controlFamily));
  if (typeof fields.level === "number") add("Level", String(fields.level));
  add("Effective", text(fields.effectiveDate) && formatIsoDate(text(fields.effectiveDate)));
  add("Expiration date", text(fields.expirationDate) && formatIsoDate(text(fields.expirationDate)));
  add("Issued", text(fields.issueDate) && formatIsoDate(text(fields.issueDate)));
  add("Expiration date", text(fields.expiryDate) && formatIsoDate(text(fields.expiryDate)));
  if (fields.statutory === true) add("Workers' compensation", "Statutory");
  const limits =
    fields.limits && typeof fields.limits === "object" ? (fields.limits as Record<string, unknown>) : {};
  for (const [name, value] of Object.entries(limits))
    if (typeof value === "number") add(LIMIT_LABELS[name as LimitName] ?? name, formatDollars(value));
  if (typeof fields.additionalInsured === "boolean")
    add("Additional insured", fields.additionalInsured ? "Yes" : "No");
  if (typeof fields.waiverOfSubrogation === "boolean")
    add("Waiver of subrogation", fields.waiverOfSubrogation ? "Yes" : "No");
  return facts;
}

/** Every verified credential with its dates and limits; insurance certificates can be downloaded. */
export function ProfileCredentials({ credentials }: { credentials: readonly ProfileCredential[] }) {
  if (credentials.length === 0)
    return <p className="text-sm text-ink-700">No verified credentials on file.</p>;
  return (
    <ul className="grid gap-3 md:grid-cols-2">
      {credentials.map((c) => (
        <li key={c.id} className="min-w-0 rounded-lg border border-ink-100 bg-white p-4">
          <p className="font-semibold text-ink-900">{c.typeName}</p>
          <p className="text-sm text-ink-700">
            {c.holder === "company" ? "Held by the company" : "Held by the technician"} ·{" "}
            {c.lapsesAt
              ? lapseWords(c.lapsesAt, credentialTypeByCode.get(c.typeCode)?.fieldSet, readerTimeZone())
              : "does not lapse"}
          </p>
          {/* Each fact on one line when it fits; a long value (an insurer's name) drops below its term whole rather
              than being squeezed into a narrow column, one word a line, on a phone. */}
          <dl className="mt-2 space-y-0.5 text-sm">
            {factsOf(c.fields).map(([term, value]) => (
              <div key={term} className="flex flex-wrap items-baseline justify-between gap-x-3">
                <dt className="min-w-0 text-ink-700">{term}</dt>
                <dd className="min-w-0 break-words text-ink-900">{value}</dd>
              </div>
            ))}
          </dl>
          {c.documentId !== null && (
            <a
              href={`/api/documents/${c.documentId}/file`}
              className="mt-2 inline-flex min-h-11 items-center text-sm font-medium text-ink-900 underline underline-offset-2"
            >
              Download the certificate of insurance ({c.typeName})
            </a>
          )}
        </li>
      ))}
    </ul>
  );
}
