import { useSuspenseQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { machineStateLabels, requestKindLabels } from "@shared/service-requests/schemas.ts";
import { hrefs } from "@/config/paths.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { serviceRequestsQuery } from "@/features/service-requests/api/get-service-requests.ts";
import { RequestStatusBadge } from "@/features/service-requests/components/request-status-badge.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(serviceRequestsQuery());
  return null;
}

const answerWords = { estimate: "Estimate sent", pass: "Passed" } as const;

export function Component() {
  const { data: requests } = useSuspenseQuery(serviceRequestsQuery());
  return (
    <>
      <PageHeader
        title="Service requests"
        description="Requests from shops near your technicians. Answer with an estimate or pass."
      />
      <ul className="space-y-2">
        {requests.length === 0 && <li>No requests yet.</li>}
        {requests.map((r) => (
          <li key={r.id} className="space-y-1 rounded-md border border-ink-100 bg-white p-3">
            <div className="flex flex-wrap items-center gap-2">
              <RequestStatusBadge status={r.status} />
              <Link className="font-medium underline" to={hrefs.providerServiceRequest(r.id)}>
                #{r.id} {machineStateLabels[r.machineState]}: {r.problem}
              </Link>
            </div>
            <div className="text-sm text-ink-700">
              {requestKindLabels[r.kind]} · {r.siteArea} · {formatDateTime(r.sentAt)} ·{" "}
              {r.answer ? answerWords[r.answer] : "Not answered"}
            </div>
          </li>
        ))}
      </ul>
    </>
  );
}
