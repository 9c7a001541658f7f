import type { RequirementSetDto as RequirementSetView } from "@shared/standing/schemas.ts";
import { offeredLimits } from "@/components/requirements/requirement-draft.ts";

const limitWords = new Map<string, string>(
  offeredLimits.map(([name, label]) => [name, label.replace(/ \(\$\)$/, "")]),
);

type RequirementSetSummaryProps = {
  set: RequirementSetView;
  siteName: string | null;
  typeNames: ReadonlyMap<string, string>;
};

/** One set as a list of its requirements in words. */
export function RequirementSetSummary({ set, siteName, typeNames }: RequirementSetSummaryProps) {
  return (
    <div>
      <h2 className="text-lg font-semibold text-ink-900">{set.name}</h2>
      <p className="text-sm text-ink-700">{siteName ? `For ${siteName}` : "For every site"}</p>
      <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-ink-900">
        {set.requirements.map((r, i) => (
          <li key={r.id ?? i}>
            <span className="font-medium">{r.label}</span>:{" "}
            {r.typeCodes.map((c) => typeNames.get(c) ?? c).join(" or ")}
            {r.minLimits &&
              Object.entries(r.minLimits).map(([name, value]) => (
                <span key={name}>
                  , {limitWords.get(name) ?? name} at least ${value?.toLocaleString("en-US")}
                </span>
              ))}
            {r.additionalInsured && ", additional insured"}
            {r.waiverOfSubrogation && ", waiver of subrogation"}
            {r.maxAgeMonths && `, no older than ${r.maxAgeMonths} months`}
            {r.builder && `, ${r.builder}`}
            {r.controlFamily && ` ${r.controlFamily}`}
            {r.minLevel && ` level ${r.minLevel}+`}
          </li>
        ))}
      </ul>
    </div>
  );
}
