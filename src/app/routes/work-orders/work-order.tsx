import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { onSiteLines } from "@shared/work-orders/on-site-lines.ts";
import { technologyLabels, type MachineTechnology } from "@shared/technicians/schemas.ts";
import { problemAreaLabels } from "@shared/machines/service-history.ts";
import { requestKindLabels } from "@shared/service-requests/schemas.ts";
import { hrefs, paths } from "@/config/paths.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { SafetyCaution } from "@/components/ui/safety-caution.tsx";
import { StatusKey } from "@/components/ui/status-key.tsx";
import { Spinner } from "@/components/ui/spinner.tsx";
import { currentUserQuery } from "@/features/accounts/api/get-current-user.ts";
import { useWorkOrderReview } from "@/features/reviews/api/get-work-order-review.ts";
import { useWriteReview } from "@/features/reviews/api/write-review.ts";
import { ReviewForm } from "@/features/reviews/components/review-form.tsx";
import { ReviewView } from "@/features/reviews/components/review-view.tsx";
import { workOrderMessagesQuery } from "@/features/work-orders/api/get-work-order-messages.ts";
import { workOrderQuery } from "@/features/work-orders/api/get-work-order.ts";
import type { WorkOrderDto as WorkOrder } from "@shared/work-orders/schemas.ts";
import { MessageThread } from "@/features/work-orders/components/message-thread.tsx";
import { StandingSnapshotView } from "@/features/work-orders/components/standing-snapshot-view.tsx";
import { useDirectorySearch } from "@/features/directory/api/search-directory.ts";
import { SendAgainPanel } from "@/features/work-orders/components/send-again-panel.tsx";
import { WorkOrderActions } from "@/features/work-orders/components/work-order-actions.tsx";
import { WorkOrderStatusBadge } from "@/features/work-orders/components/work-order-status-badge.tsx";
import { urgencyWords } from "@/features/work-orders/components/work-order-words.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { formatIsoDate } from "@/lib/format-date.ts";
import { queryClient } from "@/lib/query-client.ts";
import { workOrderIdOf } from "./work-order-id.ts";

export async function loader({ params }: LoaderFunctionArgs) {
  const id = workOrderIdOf(params);
  await Promise.all([
    queryClient.ensureQueryData(workOrderQuery(id)),
    queryClient.ensureQueryData(workOrderMessagesQuery(id)),
    queryClient.ensureQueryData(currentUserQuery()),
  ]);
  return null;
}

const technologyWord = (t: string) => technologyLabels[t as MachineTechnology] ?? t;

function Facts({ workOrder }: { workOrder: WorkOrder }) {
  const m = workOrder.equipment;
  const rows: [string, string][] = [
    ["Shop and site", `${workOrder.shop.name}, ${workOrder.site.name}`],
    ["Technician", `${workOrder.technician.name} (${workOrder.technician.companyName})`],
    [
      "Machine",
      m
        ? [m.builder, m.model, m.controlFamily, m.serialNumber && `serial ${m.serialNumber}`]
            .filter(Boolean)
            .join(" · ")
        : "Not named",
    ],
    ["Technology", technologyWord(workOrder.technology)],
    ["Urgency", urgencyWords[workOrder.urgency]],
    ["Preferred dates", workOrder.preferredDates.map(formatIsoDate).join(", ") || "None given"],
    [
      "Checked against",
      workOrder.requirementSet
        ? `${workOrder.requirementSet.name} and the platform baseline`
        : "The platform baseline",
    ],
    ["Raised", `${formatDateTime(workOrder.createdAt)} by ${workOrder.createdBy.name}`],
  ];
  if (workOrder.arrivalAt) rows.push(["Arrival", formatDateTime(workOrder.arrivalAt)]);
  if (workOrder.declineReason) rows.push(["Reason for declining", workOrder.declineReason]);
  if (workOrder.proposedDate) rows.push(["Proposed instead", formatIsoDate(workOrder.proposedDate)]);
  if (workOrder.cancelReason)
    rows.push([
      "Cancelled",
      `${workOrder.cancelledAt ? `${formatDateTime(workOrder.cancelledAt)}: ` : ""}${workOrder.cancelReason}`,
    ]);
  if (workOrder.disputeReason && workOrder.status === "disputed")
    rows.push(["Disputed", workOrder.disputeReason]);
  if (workOrder.hoursWorked !== null)
    rows.push(["Hours", `${workOrder.hoursWorked} h on site, ${workOrder.travelHours ?? 0} h travel`]);
  if (workOrder.completionNote) rows.push(["Completion note", workOrder.completionNote]);
  if (workOrder.kind) rows.push(["Kind of work", requestKindLabels[workOrder.kind]]);
  if (workOrder.problemArea) rows.push(["Problem area", problemAreaLabels[workOrder.problemArea]]);
  if (workOrder.partsUsed?.length)
    rows.push([
      "Parts used",
      workOrder.partsUsed
        .map((p) => `${p.quantity} × ${p.description}${p.partNumber ? ` (${p.partNumber})` : ""}`)
        .join("; "),
    ]);
  return (
    <section aria-label="Details" className="rounded-lg border border-ink-100 bg-white p-4">
      <p className="mb-3 whitespace-pre-line text-ink-900">{workOrder.problem}</p>
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[max-content_1fr]">
        {rows.map(([term, value]) => (
          <div key={term} className="contents">
            <dt className="font-medium text-ink-700">{term}</dt>
            <dd className="text-ink-900">{value}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}

/** The job sheet; the service side receives it only once it has accepted (the server leaves it out before). */
function OnSiteDetails({ workOrder }: { workOrder: WorkOrder }) {
  if (!workOrder.onSite) {
    return (
      <p className="rounded-lg border border-ink-100 bg-white p-4 text-sm text-ink-700">
        The street address, on-site contact, PO number, not-to-exceed amount and site induction arrive here
        once you accept.
      </p>
    );
  }
  return (
    <section aria-labelledby="on-site" className="rounded-lg border border-ink-100 bg-white p-4">
      <h2 id="on-site" className="mb-2 font-semibold text-ink-900">
        On site
      </h2>
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[max-content_1fr]">
        {onSiteLines(workOrder.onSite).map(([term, value]) => (
          <div key={term} className="contents">
            <dt className="font-medium text-ink-700">{term}</dt>
            <dd className="whitespace-pre-line break-words text-ink-900">{value}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}

/** Other cleared technicians for the same site and technology, as the directory lists them to this shop. */
function SendAgain({ workOrder }: { workOrder: WorkOrder }) {
  const navigate = useNavigate();
  const search = new URLSearchParams({ siteId: String(workOrder.site.id), technology: workOrder.technology });
  if (workOrder.requirementSet) search.set("requirementSetId", String(workOrder.requirementSet.id));
  const directory = useDirectorySearch(search.toString());
  const rows = directory.data?.pages.flatMap((p) => p.rows) ?? [];
  const choices = rows
    .filter((r) => r.technicianId !== workOrder.technician.id)
    .map((r) => ({ value: String(r.technicianId), label: `${r.name} (${r.companyName})` }));
  return (
    <SendAgainPanel workOrder={workOrder} choices={choices} onSent={(id) => navigate(hrefs.workOrder(id))} />
  );
}

function ReviewSection({ workOrder, role }: { workOrder: WorkOrder; role: string }) {
  const review = useWorkOrderReview(workOrder.id);
  const write = useWriteReview(workOrder.id);
  if (review.isPending) return <Spinner label="Loading the rating" />;
  const existing = review.data ?? null;
  return (
    <section aria-labelledby="rating" className="space-y-3 rounded-lg border border-ink-100 bg-white p-4">
      <h2 id="rating" className="text-lg font-semibold text-ink-900">
        Rating
      </h2>
      {existing ? (
        <ReviewView review={existing} canReply={role === "provider_admin"} />
      ) : workOrder.yourSide === "shop" ? (
        <ReviewForm
          pending={write.isPending}
          serverError={write.error}
          onSubmit={(input) => write.mutate(input)}
        />
      ) : (
        <p className="text-sm text-ink-700">The shop has not rated this job yet.</p>
      )}
    </section>
  );
}

export function Component() {
  const id = workOrderIdOf(useParams());
  const { data: workOrder } = useSuspenseQuery(workOrderQuery(id));
  const { data: messages } = useSuspenseQuery(workOrderMessagesQuery(id));
  const { data: user } = useSuspenseQuery(currentUserQuery());
  const back = workOrder.yourSide === "shop" ? paths.buyer.workOrders : paths.provider.workOrders;
  return (
    <>
      <Link
        to={back}
        className="mb-2 inline-flex min-h-11 items-center text-sm text-ink-700 underline underline-offset-2"
      >
        All work orders
      </Link>
      <PageHeader
        title={`Work order #${workOrder.id}`}
        description={
          <span className="flex flex-wrap items-center gap-2">
            <WorkOrderStatusBadge status={workOrder.status} />
            <span>
              {technologyWord(workOrder.technology)} at {workOrder.site.name}
            </span>
          </span>
        }
      />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="space-y-6">
          <SafetyCaution />
          <Facts workOrder={workOrder} />
          {workOrder.copiedFromId !== null && (
            <p className="text-sm text-ink-700">
              Copied from{" "}
              <Link to={hrefs.workOrder(workOrder.copiedFromId)} className="underline underline-offset-2">
                work order #{workOrder.copiedFromId}
              </Link>
              .
            </p>
          )}
          {workOrder.copies.length > 0 && (
            <p className="text-sm text-ink-700">
              Sent on as{" "}
              {workOrder.copies.map((copy, i) => (
                <span key={copy}>
                  {i > 0 && ", "}
                  <Link to={hrefs.workOrder(copy)} className="underline underline-offset-2">
                    work order #{copy}
                  </Link>
                </span>
              ))}
              .
            </p>
          )}
          <OnSiteDetails workOrder={workOrder} />
          <WorkOrderActions workOrder={workOrder} />
          {workOrder.canSendAgain && <SendAgain workOrder={workOrder} />}
          {(workOrder.snapshotAccepted || workOrder.snapshotCompleted) && (
            <section aria-labelledby="proof" className="space-y-3">
              <h2 id="proof" className="text-lg font-semibold text-ink-900">
                Proof of standing
              </h2>
              {workOrder.snapshotAccepted && (
                <StandingSnapshotView
                  workOrderId={workOrder.id}
                  at="accepted"
                  snapshot={workOrder.snapshotAccepted}
                />
              )}
              {workOrder.snapshotCompleted && (
                <StandingSnapshotView
                  workOrderId={workOrder.id}
                  at="completed"
                  snapshot={workOrder.snapshotCompleted}
                />
              )}
            </section>
          )}
          <StatusKey
            statuses={[
              "requested",
              "accepted",
              "declined",
              "completed",
              "disputed",
              "confirmed",
              "cancelled",
              "cleared",
              "lapsing",
              "not_cleared",
              "met",
              "unmet",
            ]}
          />
          {workOrder.status === "confirmed" && (
            <ReviewSection workOrder={workOrder} role={user?.role ?? ""} />
          )}
        </div>
        <MessageThread
          workOrderId={workOrder.id}
          messages={messages}
          sideNames={{ shop: workOrder.shop.name, service: workOrder.technician.companyName }}
        />
      </div>
    </>
  );
}
