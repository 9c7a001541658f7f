import type { ServiceRequestDto } from "@shared/service-requests/schemas.ts";
import { machineStateLabels, requestKindLabels } from "@shared/service-requests/schemas.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { formatIsoDate } from "@/lib/format-date.ts";
import { RequestStatusBadge } from "./request-status-badge.tsx";

/** What was asked: the machine, the site (the street only for those who may see it), the problem and the files. */
export function RequestFacts({ request }: { request: ServiceRequestDto }) {
  const place = [
    request.site.name,
    request.site.street,
    `${request.site.city}, ${request.site.state} ${request.site.postalCode}`,
  ]
    .filter(Boolean)
    .join(" · ");
  return (
    <section aria-label="The request" className="space-y-3 rounded-md border border-ink-100 bg-white p-4">
      <div className="flex flex-wrap items-center gap-2">
        <RequestStatusBadge status={request.status} />
        <span className="font-medium">{machineStateLabels[request.machineState]}</span>
        <span className="text-ink-700">· {requestKindLabels[request.kind]}</span>
      </div>
      <dl className="grid gap-2 text-sm sm:grid-cols-2">
        <div>
          <dt className="text-ink-600">Machine</dt>
          <dd>
            {request.machine
              ? `${request.machine.builder} ${request.machine.model} (${request.machine.controlFamily})`
              : request.technology}
          </dd>
        </div>
        <div>
          <dt className="text-ink-600">Site</dt>
          <dd>{place}</dd>
        </div>
        <div>
          <dt className="text-ink-600">When</dt>
          <dd>
            {request.timing === "soonest"
              ? "Soonest available"
              : `Between ${formatIsoDate(request.windowStart)} and ${formatIsoDate(request.windowEnd)}`}
          </dd>
        </div>
        <div>
          <dt className="text-ink-600">Requirements</dt>
          <dd>{request.requirementSet.name}</dd>
        </div>
        <div>
          <dt className="text-ink-600">Sent</dt>
          <dd>{formatDateTime(request.sentAt)}</dd>
        </div>
      </dl>
      <p className="whitespace-pre-wrap">{request.problem}</p>
      {request.cancelReason && <p className="text-sm text-ink-700">Cancelled: {request.cancelReason}</p>}
      {request.attachments.length > 0 && (
        <ul className="flex flex-wrap gap-3" aria-label="Attachments">
          {request.attachments.map((a) => (
            <li key={a.id}>
              {a.mime.startsWith("image/") ? (
                <a href={a.url} target="_blank" rel="noreferrer">
                  <img
                    src={a.url}
                    alt={a.name}
                    className="h-24 w-24 rounded border border-ink-200 object-cover"
                  />
                </a>
              ) : (
                <a className="underline" href={a.url}>
                  {a.name}
                </a>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
