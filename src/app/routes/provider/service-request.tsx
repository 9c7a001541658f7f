import { useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { techniciansQuery } from "@/features/technicians/api/get-technicians.ts";
import { serviceRequestQuery } from "@/features/service-requests/api/get-service-request.ts";
import { useAnswerServiceRequest } from "@/features/service-requests/api/answer-service-request.ts";
import { EstimateForm } from "@/features/service-requests/components/estimate-form.tsx";
import { RequestFacts } from "@/features/service-requests/components/request-facts.tsx";
import { requestIdOf } from "@/features/service-requests/components/request-id.ts";
import { RequestStatusBadge } from "@/features/service-requests/components/request-status-badge.tsx";
import { RequestThread } from "@/features/service-requests/components/request-thread.tsx";
import type { ServiceRequestDto } from "@shared/service-requests/schemas.ts";
import { formatCents } from "@/lib/format-money.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { queryClient } from "@/lib/query-client.ts";

export async function loader({ params }: LoaderFunctionArgs) {
  await Promise.all([
    queryClient.ensureQueryData(serviceRequestQuery(requestIdOf(params))),
    queryClient.ensureQueryData(techniciansQuery()),
  ]);
  return null;
}

export function Component() {
  const id = requestIdOf(useParams());
  const { data: request } = useSuspenseQuery(serviceRequestQuery(id));
  const { data: technicians } = useSuspenseQuery(techniciansQuery());
  const answer = useAnswerServiceRequest(id);
  const [reason, setReason] = useState("");
  const estimate = request.estimates[0] ?? null;
  const companyId = request.invitations[0]!.companyId;
  const can = (action: ServiceRequestDto["actions"][number]) => request.actions.includes(action);
  return (
    <>
      <PageHeader title={`Service request #${request.id}`} />
      <div className="mx-auto max-w-2xl space-y-6">
        <RequestFacts request={request} />
        {estimate && (
          <section
            className="space-y-1 rounded-md border border-ink-100 bg-white p-4"
            aria-label="Your estimate"
          >
            <div className="flex items-center gap-2">
              <h2 className="text-lg font-semibold">Your estimate</h2>
              <RequestStatusBadge status={estimate.status} />
            </div>
            {estimate.status === "not_chosen" && <p>The shop chose another estimate this time.</p>}
            {estimate.status === "accepted" && request.workOrderId && (
              <p>
                Accepted:{" "}
                <Link className="underline" to={hrefs.workOrder(request.workOrderId)}>
                  work order #{request.workOrderId}
                </Link>
              </p>
            )}
            <ol className="text-sm">
              {estimate.revisions.map((r) => (
                <li key={r.revision}>
                  Revision {r.revision}: {formatCents(r.total.totalCents)} before tax, {r.technicianName},
                  arrives {formatDateTime(r.earliestArrival)}
                </li>
              ))}
            </ol>
          </section>
        )}
        {(can("estimate") || can("revise")) && (
          <section className="space-y-2">
            <h2 className="text-lg font-semibold">
              {can("revise") ? "Revise your estimate" : "Send an estimate"}
            </h2>
            <EstimateForm
              key={estimate?.current.revision ?? 0}
              technicians={technicians.filter((t) => t.active)}
              current={can("revise") ? (estimate?.current ?? null) : null}
              timeZone={request.site.timeZone}
              pending={answer.isPending}
              error={answer.error}
              submitLabel={can("revise") ? "Send revision" : "Send estimate"}
              onSubmit={(input) =>
                answer.mutate(
                  can("revise") && estimate
                    ? { kind: "revise", estimateId: estimate.id, input }
                    : { kind: "estimate", input },
                )
              }
            />
          </section>
        )}
        {can("withdraw") && estimate && (
          <Button
            variant="secondary"
            pending={answer.isPending}
            onClick={() => answer.mutate({ kind: "withdraw", estimateId: estimate.id })}
          >
            Withdraw estimate
          </Button>
        )}
        {can("pass") && (
          <section className="space-y-2">
            <h2 className="text-lg font-semibold">Pass</h2>
            <TextField
              label="Why you pass"
              name="reason"
              value={reason}
              onChange={(e) => setReason(e.target.value)}
            />
            <Button
              variant="secondary"
              pending={answer.isPending}
              onClick={() => answer.mutate({ kind: "pass", reason })}
            >
              Pass on this request
            </Button>
            <FormError error={answer.error} />
          </section>
        )}
        <RequestThread
          requestId={id}
          companyId={companyId}
          title="Messages with the shop"
          readOnly={!can("message")}
        />
      </div>
    </>
  );
}
