import { PageHeader } from "@/components/ui/page-header.tsx";
import { GateCheckLog } from "@/features/gate/components/gate-check-log.tsx";

export function Component() {
  return (
    <>
      <PageHeader
        title="Gate checks"
        description="Each time a shop's front desk scanned one of your technicians' badges, and what it showed."
      />
      <GateCheckLog side="service" />
    </>
  );
}
