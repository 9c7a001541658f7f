import { CautionNote } from "@/components/ui/caution-note.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { useBrokerCoverages } from "@/features/credentials/api/broker-requests.ts";
import { BrokerPanel } from "@/features/credentials/components/broker-panel.tsx";
import { CoverageBrokerCard } from "@/features/credentials/components/coverage-broker-card.tsx";

export function Component() {
  const coverages = useBrokerCoverages();
  return (
    <>
      <PageHeader
        title="Insurance brokers"
        description="Who issues each of your coverages' certificates. A request sends that broker a one-time upload link; reminders follow before the lapse if nothing arrives."
      />
      <div className="space-y-4">
        <BrokerPanel coverages={[]} />
        {coverages.isPending && <p role="status">Loading coverages…</p>}
        {coverages.data?.map((row) => (
          <CoverageBrokerCard key={row.typeCode} row={row} />
        ))}
        <CautionNote />
      </div>
    </>
  );
}
