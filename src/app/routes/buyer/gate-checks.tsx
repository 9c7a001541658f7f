import { PageHeader } from "@/components/ui/page-header.tsx";
import { GateCheckLog } from "@/features/gate/components/gate-check-log.tsx";

export function Component() {
  return (
    <>
      <PageHeader
        title="Gate checks"
        description="Each badge scanned at your sites' gates, and whether the technician was cleared at that instant."
      />
      <GateCheckLog side="shop" />
    </>
  );
}
