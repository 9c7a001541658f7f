import { useState } from "react";
import { FormError } from "@/components/ui/form-error.tsx";
import { Spinner } from "@/components/ui/spinner.tsx";
import { useTechnicianStanding } from "../api/get-technician-standing.ts";
import { StandingPanel, type StandingViewer } from "./standing-panel.tsx";

type StandingSectionProps = { technicianId: number; loadingLabel: string; viewer?: StandingViewer };

/** One technician's standing under its own heading; it loads after the page, so a slow answer never holds the page up. */
export function StandingSection({ technicianId, loadingLabel, viewer = "office" }: StandingSectionProps) {
  const standing = useTechnicianStanding(technicianId);
  const [now] = useState(() => new Date());
  return (
    <section aria-labelledby="standing-heading">
      <h2 id="standing-heading" className="mb-3 text-lg font-semibold text-ink-900">
        Standing
      </h2>
      {standing.isPending ? (
        <Spinner label={loadingLabel} />
      ) : standing.isError ? (
        <FormError error={standing.error} />
      ) : (
        <StandingPanel standing={standing.data ?? null} now={now} viewer={viewer} />
      )}
    </section>
  );
}
