import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { workOrderStatuses, type WorkOrderStatus } from "@shared/work-orders/schemas.ts";
import { paths } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { StatusKey } from "@/components/ui/status-key.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { currentUserQuery } from "@/features/accounts/api/get-current-user.ts";
import { workOrdersQuery } from "@/features/work-orders/api/get-work-orders.ts";
import { workOrderStatusWords } from "@/features/work-orders/components/work-order-status-badge.tsx";
import { WorkOrdersTable } from "@/features/work-orders/components/work-orders-table.tsx";
import { queryClient } from "@/lib/query-client.ts";

const statusOf = (params: URLSearchParams): WorkOrderStatus | null => {
  const value = params.get("status");
  return workOrderStatuses.find((s) => s === value) ?? null;
};

export async function loader({ request }: LoaderFunctionArgs) {
  await Promise.all([
    queryClient.ensureQueryData(workOrdersQuery(statusOf(new URL(request.url).searchParams))),
    queryClient.ensureQueryData(currentUserQuery()),
  ]);
  return null;
}

/** Both sides' list: the buyer's shop sees what it raised, the service company (or technician) what it was sent. */
export function Component() {
  const [params, setParams] = useSearchParams();
  const status = statusOf(params);
  const { data: workOrders } = useSuspenseQuery(workOrdersQuery(status));
  const { data: user } = useSuspenseQuery(currentUserQuery());
  const isBuyer = user?.role === "buyer";
  return (
    <>
      <PageHeader
        title="Work orders"
        description={
          isBuyer
            ? "Work you have requested from technicians: follow it, confirm completion and rate the job."
            : "Requests from machine shops: accept or decline, record completion, and keep the message thread."
        }
      />
      <div className="mb-4 max-w-xs">
        <SelectField
          label="Status"
          name="status"
          options={workOrderStatuses.map((s) => ({ value: s, label: workOrderStatusWords[s] }))}
          placeholder="Every status"
          value={status ?? ""}
          onChange={(e) => setParams(e.target.value ? { status: e.target.value } : {})}
        />
      </div>
      {workOrders.length === 0 ? (
        <EmptyState
          title={
            status ? `No work orders are ${workOrderStatusWords[status].toLowerCase()}` : "No work orders yet"
          }
          action={
            isBuyer && (
              <Link to={paths.buyer.directory} className={buttonStyles("primary")}>
                Find a technician
              </Link>
            )
          }
        >
          {isBuyer
            ? "Raise one from a technician's page in the directory."
            : "Shops' requests to your technicians appear here."}
        </EmptyState>
      ) : (
        <WorkOrdersTable workOrders={workOrders} />
      )}
      <StatusKey statuses={["requested", "accepted", "declined", "completed", "confirmed"]} />
    </>
  );
}
