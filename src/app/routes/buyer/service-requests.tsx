import { useSuspenseQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { machineStateLabels, requestKindLabels } from "@shared/service-requests/schemas.ts";
import { hrefs, paths } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { serviceRequestsQuery } from "@/features/service-requests/api/get-service-requests.ts";
import { RequestStatusBadge } from "@/features/service-requests/components/request-status-badge.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(serviceRequestsQuery());
  return null;
}

export function Component() {
  const { data: requests } = useSuspenseQuery(serviceRequestsQuery());
  return (
    <>
      <PageHeader
        title="Service requests"
        description="Ask every cleared company near the site at once, then compare their estimates."
        actions={
          <Link className={buttonStyles("primary")} to={paths.buyer.serviceRequestNew}>
            New service request
          </Link>
        }
      />
      <ul className="space-y-2">
        {requests.length === 0 && <li>No service requests yet.</li>}
        {requests.map((r) => (
          <li
            key={r.id}
            className="flex flex-wrap items-center gap-2 rounded-md border border-ink-100 bg-white p-3"
          >
            <RequestStatusBadge status={r.status} />
            <Link className="font-medium underline" to={hrefs.buyerServiceRequest(r.id)}>
              #{r.id} {machineStateLabels[r.machineState]}: {r.problem}
            </Link>
            <span className="text-sm text-ink-700">
              {requestKindLabels[r.kind]} · {r.siteArea} · sent {formatDateTime(r.sentAt)} · {r.invited}{" "}
              invited · {r.estimates} {r.estimates === 1 ? "estimate" : "estimates"}
            </span>
          </li>
        ))}
      </ul>
    </>
  );
}
