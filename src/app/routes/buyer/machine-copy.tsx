import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { paths } from "@/config/paths.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { StatusKey } from "@/components/ui/status-key.tsx";
import { formatInstantDate } from "@/lib/format-date.ts";
import { queryClient } from "@/lib/query-client.ts";
import { machineHistoryQuery } from "@/features/machines/api/get-machine-history.ts";
import { machineTransfersQuery } from "@/features/machines/api/get-machine-transfers.ts";
import { ServiceHistory } from "@/features/machines/components/service-history.tsx";
import { machineIdOf } from "./machine-id.ts";

export async function loader({ params }: LoaderFunctionArgs) {
  const id = machineIdOf(params);
  await Promise.all([
    queryClient.ensureQueryData(machineHistoryQuery(id)),
    queryClient.ensureQueryData(machineTransfersQuery()),
  ]);
  return null;
}

/**
 * A machine the shop sold: the history it kept, up to the day it handed the machine over, read-only. What the new
 * owner recorded since is theirs and is not shown (the server filters by ownership period).
 */
export function Component() {
  const id = machineIdOf(useParams());
  const { data: history } = useSuspenseQuery(machineHistoryQuery(id));
  const { data: transfers } = useSuspenseQuery(machineTransfersQuery());
  const sale = transfers.outgoing.find((t) => t.machineId === id && t.state === "accepted");
  const m = sale?.machine;
  return (
    <>
      <Link
        to={paths.buyer.machineTransfers}
        className="mb-2 inline-flex min-h-11 items-center text-sm text-ink-700 underline underline-offset-2"
      >
        All transfers
      </Link>
      <PageHeader
        title={m ? `${m.builder} ${m.model}` : "A machine you sold"}
        description={
          <span className="break-words">
            {m?.serialNumber ? `Serial ${m.serialNumber} · ` : ""}
            {sale
              ? `Sold to ${sale.toShopName} on ${formatInstantDate(sale.decidedAt)}. Your read-only copy of its history up to that day.`
              : "Your read-only copy of its history up to the day you handed it over."}
          </span>
        }
      />
      <div className="max-w-3xl space-y-4">
        <ServiceHistory history={history} exports={false} />
        <StatusKey statuses={["cleared", "lapsing", "not_cleared"]} />
      </div>
    </>
  );
}
