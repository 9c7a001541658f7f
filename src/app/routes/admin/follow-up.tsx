import { useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { machineStateLabels } from "@shared/service-requests/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { followUpsQuery } from "@/features/service-requests/api/get-follow-ups.ts";
import { useLogFollowUp } from "@/features/service-requests/api/log-follow-up.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(followUpsQuery());
  return null;
}

export function Component() {
  const { data: rows } = useSuspenseQuery(followUpsQuery());
  const log = useLogFollowUp();
  const [notes, setNotes] = useState<Record<number, string>>({});
  return (
    <>
      <PageHeader
        title="Follow-up"
        description="Open requests whose invited companies were reminded and that still have no estimate. Machine-down requests first."
      />
      <FormError error={log.error} />
      <ul className="space-y-3">
        {rows.length === 0 && <li>Nothing to chase.</li>}
        {rows.map((r) => (
          <li key={r.requestId} className="space-y-2 rounded-md border border-ink-100 bg-white p-3">
            <div className="font-medium">
              #{r.requestId} {machineStateLabels[r.machineState]} · {r.shopName} · {r.siteArea}
            </div>
            <div className="text-sm text-ink-700">
              Sent {formatDateTime(r.sentAt)} · {r.answered} of {r.invited} answered · {r.remindersSent}{" "}
              reminders
              {r.lastAction && ` · last: ${r.lastAction}`}
            </div>
            <div className="flex flex-wrap items-end gap-2">
              <TextField
                label="What you did"
                name={`note-${r.requestId}`}
                value={notes[r.requestId] ?? ""}
                onChange={(e) => setNotes((n) => ({ ...n, [r.requestId]: e.target.value }))}
              />
              <Button
                variant="secondary"
                pending={log.isPending}
                onClick={() => log.mutate({ requestId: r.requestId, note: notes[r.requestId] ?? "" })}
              >
                Log it
              </Button>
            </div>
          </li>
        ))}
      </ul>
    </>
  );
}
