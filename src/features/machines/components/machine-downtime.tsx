import { useState, type FormEvent } from "react";
import { useQuery } from "@tanstack/react-query";
import type { MachineDowntimeDto } from "@shared/machines/downtime-schemas.ts";
import type { MachineState } from "@shared/sites/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { machineDowntimeQuery } from "../api/get-machine-downtime.ts";
import { useMarkMachineState } from "../api/mark-machine-state.ts";
import { DowntimeChart } from "./downtime-chart.tsx";

const hoursWords = (hours: number | null) =>
  hours === null ? "Not measured" : hours >= 48 ? `${(hours / 24).toFixed(1)} days` : `${hours} h`;

const openerWords: Record<MachineDowntimeDto["recent"][number]["openedBy"], string> = {
  hand: "marked by the shop",
  service_request: "service request",
  work_order: "work order",
};

/** Marks the machine down or running again, now or at a time the shop gives (the stop on the night shift). */
function StateChange({ machineId, down }: { machineId: number; down: boolean }) {
  const mark = useMarkMachineState(machineId);
  const [when, setWhen] = useState("");
  const submit = (event: FormEvent) => {
    event.preventDefault();
    const at = when ? new Date(when) : null;
    mark.mutate(
      {
        state: down ? "running" : "down",
        ...(at && !Number.isNaN(at.getTime()) ? { at: at.toISOString() } : {}),
      },
      { onSuccess: () => setWhen("") },
    );
  };
  return (
    <form onSubmit={submit} className="mt-3 space-y-2" aria-label={down ? "Mark running again" : "Mark down"}>
      <FormError error={mark.error} labels={{ "body.at": "When" }} />
      <div className="flex flex-wrap items-end gap-3">
        <TextField
          label="When"
          name="at"
          type="datetime-local"
          value={when}
          onChange={(e) => setWhen(e.target.value)}
          hint="Leave empty for now; your own time zone"
        />
        <Button type="submit" variant={down ? "primary" : "secondary"} pending={mark.isPending}>
          {down ? "Running again" : "Mark down"}
        </Button>
      </div>
    </form>
  );
}

/** The machine page's downtime panel: the year in hours per month, and how fast each company came and fixed it. */
export function MachineDowntime({ machineId, state }: { machineId: number; state: MachineState }) {
  const { data, isPending, isError } = useQuery(machineDowntimeQuery(machineId));
  return (
    <section aria-labelledby="machine-downtime" className="rounded-lg border border-ink-100 bg-white p-4">
      <h2 id="machine-downtime" className="text-lg font-semibold text-ink-900">
        Downtime, last 12 months
      </h2>
      {isPending && <p className="mt-2 text-sm text-ink-700">Loading downtime…</p>}
      {isError && (
        <p className="mt-2 text-sm text-red-900">The downtime could not be loaded; reload the page.</p>
      )}
      {data && (
        <>
          <p className="mt-1 text-sm text-ink-900" data-testid="downtime-now">
            {data.downSince ? (
              <strong>Down since {formatDateTime(data.downSince)}</strong>
            ) : state === "running" ? (
              "Running now."
            ) : (
              "Not in use: out of service or sold."
            )}
          </p>
          <DowntimeChart months={data.months} />
          <dl className="grid grid-cols-3 gap-2 text-sm">
            <div>
              <dt className="text-ink-700">Hours down</dt>
              <dd className="font-semibold text-ink-900">{data.totalHours} h</dd>
            </div>
            <div>
              <dt className="text-ink-700">Stoppages</dt>
              <dd className="font-semibold text-ink-900">{data.periods}</dd>
            </div>
            <div>
              <dt className="text-ink-700">Typical time to run again</dt>
              <dd className="font-semibold text-ink-900">{hoursWords(data.medianHoursToRestore)}</dd>
            </div>
          </dl>
          {(state === "running" || state === "down") && (
            <StateChange machineId={machineId} down={state === "down"} />
          )}
          {data.recent.length > 0 && (
            <details className="mt-3 text-sm">
              <summary className="cursor-pointer text-ink-700 underline underline-offset-2">
                Stoppages ({data.recent.length})
              </summary>
              <ul className="mt-2 space-y-1">
                {data.recent.map((p) => (
                  <li key={p.id}>
                    {formatDateTime(p.startedAt)} to {p.endedAt ? formatDateTime(p.endedAt) : "now"} (
                    {openerWords[p.openedBy]}
                    {p.closedBy === "confirmation" ? ", ended when the work was confirmed" : ""})
                  </li>
                ))}
              </ul>
            </details>
          )}
          <h3 className="mt-4 font-semibold text-ink-900">Service companies on this machine</h3>
          {data.companies.length === 0 ? (
            <p className="mt-1 text-sm text-ink-700">No confirmed work in the last 12 months.</p>
          ) : (
            <div className="mt-1 overflow-x-auto">
              <table className="w-full text-left text-sm">
                <thead className="text-ink-700">
                  <tr>
                    <th scope="col" className="py-1 pr-3 font-medium">
                      Company
                    </th>
                    <th scope="col" className="py-1 pr-3 font-medium">
                      Jobs
                    </th>
                    <th scope="col" className="py-1 pr-3 font-medium">
                      Response (called to on site)
                    </th>
                    <th scope="col" className="py-1 font-medium">
                      Repair (on site to done)
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {data.companies.map((c) => (
                    <tr key={c.companyId} className="border-t border-ink-100">
                      <th scope="row" className="py-1 pr-3 font-normal text-ink-900">
                        {c.companyName}
                      </th>
                      <td className="py-1 pr-3">{c.workOrders}</td>
                      <td className="py-1 pr-3">{hoursWords(c.medianResponseHours)}</td>
                      <td className="py-1">{hoursWords(c.medianRepairHours)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              <p className="mt-1 text-xs text-ink-700">
                Medians of the confirmed work orders of the last 12 months.
              </p>
            </div>
          )}
        </>
      )}
    </section>
  );
}
