import { formatCents } from "@/lib/format-money.ts";
import type { CallOutEstimateDto as CallOut } from "@shared/directory/directory-shapes.ts";

type CallOutEstimateProps = {
  callOut: CallOut;
  onSiteHours: number;
  /** Names the estimate for assistive technology when several are on one page. */
  forWhom: string;
  /** The site the estimate runs to, shown with the hours so two estimates can be compared at a glance. */
  siteName: string | null;
};

/** The inputs an estimate rests on, in words: "4 h on site, from North Plant". */
export function estimateInputsText(onSiteHours: number, siteName: string | null): string {
  return siteName ? `${onSiteHours} h on site, from ${siteName}` : `${onSiteHours} h on site`;
}

/** The total, with its three parts one tap away; always says it is an estimate before tax. */
export function CallOutEstimate({ callOut, onSiteHours, forWhom, siteName }: CallOutEstimateProps) {
  return (
    <details className="group text-sm">
      <summary
        className="min-h-11 cursor-pointer list-none py-1 marker:hidden"
        aria-label={`Service call estimate for ${forWhom}: ${formatCents(callOut.totalCents)} before tax, ${estimateInputsText(onSiteHours, siteName)}. Show its parts`}
      >
        <span className="font-semibold text-ink-900 underline decoration-dotted underline-offset-4">
          {formatCents(callOut.totalCents)}
        </span>
        <span className="block text-xs text-ink-700">estimate before tax</span>
        <span className="block text-xs text-ink-700" data-testid="estimate-inputs">
          {estimateInputsText(onSiteHours, siteName)}
        </span>
      </summary>
      <dl className="mt-1 grid grid-cols-[auto_auto] gap-x-3 gap-y-0.5 rounded-md border border-ink-100 bg-ink-50 px-3 py-2 text-xs text-ink-900">
        <dt>Travel, both ways</dt>
        <dd className="text-right">{formatCents(callOut.travelCents)}</dd>
        <dt>{onSiteHours} h on site</dt>
        <dd className="text-right">{formatCents(callOut.labourCents)}</dd>
        <dt>Mileage, both ways</dt>
        <dd className="text-right">{formatCents(callOut.mileageCents)}</dd>
        <dt className="font-semibold">Estimate before tax</dt>
        <dd className="text-right font-semibold">{formatCents(callOut.totalCents)}</dd>
      </dl>
    </details>
  );
}
