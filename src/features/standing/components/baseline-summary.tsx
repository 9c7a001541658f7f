import type { Requirement } from "@shared/standing/requirements.ts";
import { formatDollars } from "@/lib/format-money.ts";
import type { LimitName } from "@shared/credentials/credential-fields.ts";
import { LIMIT_LABELS, limitLabelWithCoverage } from "@shared/credentials/limit-lines.ts";

type BaselineSummaryProps = {
  requirements: readonly Requirement[];
  typeNames: ReadonlyMap<string, string>;
};

const limitLabel = (name: string) =>
  name in LIMIT_LABELS
    ? limitLabelWithCoverage(name as LimitName)
    : name.replace(/([A-Z])/g, " $1").toLowerCase();

// What each line asks beyond holding the credential, in words.
function conditionsOf(r: Requirement): string[] {
  const out: string[] = [];
  for (const [name, value] of Object.entries(r.minLimits ?? {})) {
    if (value !== undefined) out.push(`${limitLabel(name)} at least ${formatDollars(value)}`);
  }
  if (r.additionalInsured) out.push("additional insured");
  if (r.waiverOfSubrogation) out.push("waiver of subrogation");
  if (r.maxAgeMonths) out.push(`card no older than ${r.maxAgeMonths} months`);
  if (r.builder) out.push(`builder ${r.builder}`);
  if (r.controlFamily) out.push(`control family ${r.controlFamily}`);
  if (r.minLevel) out.push(`level ${r.minLevel} or above`);
  return out;
}

/** The saved baseline, read-only, as buyers and technicians meet it. */
export function BaselineSummary({ requirements, typeNames }: BaselineSummaryProps) {
  return (
    <ol className="space-y-2">
      {requirements.map((r, i) => {
        const conditions = conditionsOf(r);
        return (
          <li key={r.id ?? i} className="rounded-lg border border-ink-100 bg-white px-4 py-3">
            <p className="font-semibold text-ink-900">{r.label}</p>
            <p className="text-sm text-ink-700">
              Any of: {r.typeCodes.map((code) => typeNames.get(code) ?? code).join(", ")}
            </p>
            {conditions.length > 0 && <p className="text-sm text-ink-700">With {conditions.join("; ")}.</p>}
          </li>
        );
      })}
    </ol>
  );
}
