import { useState } from "react";
import { useQuery, useSuspenseQuery } from "@tanstack/react-query";
import { Link, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { Button } from "@/components/ui/button.tsx";
import { CautionNote } from "@/components/ui/caution-note.tsx";
import { SafetyCaution } from "@/components/ui/safety-caution.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { comparisonQuery } from "@/features/service-requests/api/get-comparison.ts";
import { serviceRequestQuery } from "@/features/service-requests/api/get-service-request.ts";
import { useDecideServiceRequest } from "@/features/service-requests/api/decide-service-request.ts";
import { ComparisonTable } from "@/features/service-requests/components/comparison-table.tsx";
import { RequestFacts } from "@/features/service-requests/components/request-facts.tsx";
import { requestIdOf } from "@/features/service-requests/components/request-id.ts";
import { RequestThread } from "@/features/service-requests/components/request-thread.tsx";
import { RequestTimeline } from "@/features/service-requests/components/request-timeline.tsx";
import { queryClient } from "@/lib/query-client.ts";

export async function loader({ params }: LoaderFunctionArgs) {
  await queryClient.ensureQueryData(serviceRequestQuery(requestIdOf(params)));
  return null;
}

export function Component() {
  const id = requestIdOf(useParams());
  const { data: request } = useSuspenseQuery(serviceRequestQuery(id));
  const comparison = useQuery(comparisonQuery(id));
  const decide = useDecideServiceRequest(id);
  const [reason, setReason] = useState("");
  const open = request.status === "open";
  return (
    <>
      <PageHeader title={`Service request #${request.id}`} />
      <div className="space-y-6">
        <RequestFacts request={request} />
        {request.workOrderId && (
          <p>
            Accepted:{" "}
            <Link className="underline" to={hrefs.workOrder(request.workOrderId)}>
              work order #{request.workOrderId}
            </Link>
          </p>
        )}
        <section className="space-y-2">
          <h2 className="text-lg font-semibold">Compare estimates</h2>
          <FormError error={decide.error} />
          <ComparisonTable
            rows={comparison.data?.rows ?? []}
            canAccept={request.actions.includes("accept")}
            pending={decide.isPending}
            onAccept={(estimateId) => decide.mutate({ kind: "accept", estimateId })}
          />
          <p className="text-sm text-ink-600">
            Totals are before tax. Distance is straight-line miles from the technician's base; drive time is
            an estimate.
          </p>
        </section>
        <section className="space-y-2">
          <h2 className="text-lg font-semibold">Invited companies</h2>
          <ul className="text-sm">
            {request.invitations.map((i) => (
              <li key={i.companyId}>
                {i.companyName}:{" "}
                {i.answer === null
                  ? "no answer yet"
                  : i.answer === "pass"
                    ? `passed (${i.passReason})`
                    : "sent an estimate"}
              </li>
            ))}
          </ul>
        </section>
        <section className="space-y-4">
          <h2 className="text-lg font-semibold">Messages</h2>
          {request.invitations.map((i) => (
            <RequestThread
              key={i.companyId}
              requestId={id}
              companyId={i.companyId}
              title={i.companyName}
              readOnly={!open}
            />
          ))}
        </section>
        {request.actions.includes("cancel") && (
          <section className="max-w-md space-y-2">
            <h2 className="text-lg font-semibold">Cancel the request</h2>
            <TextField
              label="Reason"
              name="reason"
              value={reason}
              onChange={(e) => setReason(e.target.value)}
            />
            <Button
              variant="secondary"
              pending={decide.isPending}
              onClick={() => decide.mutate({ kind: "cancel", reason })}
            >
              Cancel request
            </Button>
          </section>
        )}
        <section>
          <h2 className="text-lg font-semibold">Timeline</h2>
          <RequestTimeline events={request.timeline} />
        </section>
      </div>
      <SafetyCaution className="mt-6" />
      <CautionNote className="mt-6" />
    </>
  );
}
