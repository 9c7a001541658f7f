import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "react-router-dom";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";

const checkSchema = z.object({
  state: z.enum(["cleared", "not_cleared", "expired", "invalid"]),
  checkedAt: z.string(),
  technician: z.object({ name: z.string(), company: z.string(), photo: z.string().optional() }).optional(),
  site: z.object({ name: z.string() }).nullable().optional(),
  against: z.string().optional(),
  lines: z.array(z.object({ requirement: z.string(), status: z.string() })).optional(),
  workOrder: z.object({ id: z.number(), technology: z.string() }).nullable().optional(),
});

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
    queryFn: () => api.get(`/gate/check?${query.toString()}`, checkSchema),
    retry: false,
  });
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
          {check.data.technician?.photo && (
            <img
              src={check.data.technician.photo}
              alt={`Photo of ${check.data.technician.name}`}
              className="h-40 w-40 rounded object-cover"
            />
          )}
          {check.data.technician && (
            <p>
              <span className="font-semibold">{check.data.technician.name}</span>,{" "}
              {check.data.technician.company}
            </p>
          )}
          {check.data.against && (
            <p>
              Against {check.data.against}
              {check.data.site ? ` at ${check.data.site.name}` : ""}
            </p>
          )}
          {check.data.lines && (
            <ul className="list-disc pl-6">
              {check.data.lines.map((l) => (
                <li key={l.requirement}>
                  {l.requirement}: {lineState[l.status] ?? l.status}
                </li>
              ))}
            </ul>
          )}
          {check.data.workOrder && (
            <p>
              Expected today: work order #{check.data.workOrder.id} ({check.data.workOrder.technology})
            </p>
          )}
          <p className="text-sm text-slate-700">Checked {formatDateTime(check.data.checkedAt)}</p>
        </section>
      )}
    </main>
  );
}
