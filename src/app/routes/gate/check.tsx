import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "react-router-dom";
import { gateCheckDtoSchema } from "@shared/gate/check-answer.ts";
import { api } from "@/lib/api-client.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";

const headline = {
  cleared: "Cleared right now",
  not_cleared: "Not cleared",
  expired: "Expired code: ask for the badge page to be opened again",
  invalid: "Not a Clearbench badge",
} as const;

const lineState: Record<string, string> = { met: "Met", lapsing: "Met, lapsing soon", unmet: "Not met" };

/** What the front desk sees after scanning a badge; no sign-in, and nothing beyond who and whether cleared. */
export function Component() {
  const [search] = useSearchParams();
  const query = new URLSearchParams();
  query.set("token", search.get("token") ?? "");
  if (search.get("site")) query.set("site", search.get("site")!);
  const check = useQuery({
    queryKey: ["gate-check", query.toString()],
    queryFn: () => api.get(`/gate/check?${query.toString()}`, gateCheckDtoSchema),
    retry: false,
  });
  // A code that is not a badge, or has run out, answers only its state and the time.
  const read = check.data && "technician" in check.data ? check.data : null;
  return (
    <main className="mx-auto max-w-lg p-6">
      <h1 className="text-2xl font-semibold">Gate check</h1>
      {check.isPending && <p role="status">Checking…</p>}
      {check.isError && <p role="alert">The badge could not be checked. Scan it again.</p>}
      {check.data && (
        <section aria-live="polite" className="mt-4 space-y-3">
          <p
            data-state={check.data.state}
            className={`rounded p-3 text-lg font-semibold ${check.data.state === "cleared" ? "bg-green-100 text-green-900" : "bg-red-100 text-red-900"}`}
          >
            {headline[check.data.state]}
          </p>
          {read?.technician.photo && (
            <img
              src={read.technician.photo}
              alt={`Photo of ${read.technician.name}`}
              className="h-40 w-40 rounded object-cover"
            />
          )}
          {read && (
            <p>
              <span className="font-semibold">{read.technician.name}</span>, {read.technician.company}
            </p>
          )}
          {read && (
            <p>
              Against {read.against}
              {read.site ? ` at ${read.site.name}` : ""}
            </p>
          )}
          {read && (
            <ul className="list-disc pl-6">
              {read.lines.map((l) => (
                <li key={l.requirement}>
                  {l.requirement}: {lineState[l.status] ?? l.status}
                </li>
              ))}
            </ul>
          )}
          {read?.workOrder && (
            <p>
              Expected today: work order #{read.workOrder.id} ({read.workOrder.technology})
            </p>
          )}
          <p className="text-sm text-slate-700">Checked {formatDateTime(check.data.checkedAt)}</p>
        </section>
      )}
    </main>
  );
}
