import { technologyLabels } from "@shared/technicians/schemas.ts";
import { machineStateLabels } from "@shared/machines/machine-states.ts";
import { formatIsoDate } from "@/lib/format-date.ts";
import type { MachineDto as Machine } from "@shared/sites/schemas.ts";

/** The machine's record as the maintenance manager reads it. */
export function MachineRecord({ machine }: { machine: Machine }) {
  const rows: [string, string][] = [
    ["Builder", machine.builder],
    ["Control family", machine.controlFamily],
    ["Model", machine.model],
    ["Serial number", machine.serialNumber ?? "Not recorded"],
    ["Technology", technologyLabels[machine.technology]],
    ["Year built", machine.yearBuilt ? String(machine.yearBuilt) : "Not recorded"],
    ["In service since", machine.inServiceOn ? formatIsoDate(machine.inServiceOn) : "Not recorded"],
    ["Site", machine.siteName],
    ["Building, bay", [machine.building, machine.bay].filter(Boolean).join(", ") || "Not recorded"],
    ["State", machineStateLabels[machine.state ?? "running"]],
  ];
  return (
    <section aria-labelledby="machine-record" className="rounded-lg border border-ink-100 bg-white p-4">
      <h2 id="machine-record" className="mb-3 text-lg font-semibold text-ink-900">
        Record
      </h2>
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[max-content_1fr]">
        {rows.map(([term, value]) => (
          <div key={term} className="contents">
            <dt className="font-medium text-ink-700">{term}</dt>
            <dd className="break-words text-ink-900">{value}</dd>
          </div>
        ))}
      </dl>
      {machine.notes && (
        <p className="mt-3 whitespace-pre-line break-words text-sm text-ink-900">{machine.notes}</p>
      )}
    </section>
  );
}
