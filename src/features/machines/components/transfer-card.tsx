import type { ReactNode } from "react";
import { transferStatusMarks, type MachineTransferDto } from "@shared/machines/transfers.ts";
import { technologyLabels } from "@shared/technicians/schemas.ts";
import { Link } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { formatInstantDate } from "@/lib/format-date.ts";

/** One transfer as either shop reads it: the machine, the other shop, where it stands, and the caller's next step. */
export function TransferCard({ transfer, children }: { transfer: MachineTransferDto; children?: ReactNode }) {
  const mark = transferStatusMarks[transfer.state];
  const m = transfer.machine;
  const other = transfer.side === "seller" ? `To ${transfer.toShopName}` : `From ${transfer.fromShopName}`;
  return (
    <article
      aria-labelledby={`transfer-${transfer.id}`}
      className="min-w-0 space-y-2 rounded-lg border border-ink-200 bg-white p-4"
    >
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 id={`transfer-${transfer.id}`} className="min-w-0 break-words font-semibold text-ink-900">
          {m.builder} {m.model}
        </h3>
        <StatusBadge status={mark.status} word={mark.word} />
      </div>
      <dl className="grid grid-cols-1 gap-x-4 gap-y-1 text-sm text-ink-800 sm:grid-cols-2">
        <div className="min-w-0 break-words">
          <dt className="inline font-medium">Serial: </dt>
          <dd className="inline">{m.serialNumber ?? "none recorded"}</dd>
        </div>
        <div>
          <dt className="inline font-medium">Kind: </dt>
          <dd className="inline">
            {technologyLabels[m.technology]}, {m.controlFamily}
          </dd>
        </div>
        <div className="min-w-0 break-words">
          <dt className="sr-only">Other shop</dt>
          <dd>{other}</dd>
        </div>
        {transfer.toEmail && (
          <div className="min-w-0 break-all">
            <dt className="inline font-medium">Sent to: </dt>
            <dd className="inline">{transfer.toEmail}</dd>
          </div>
        )}
        <div>
          <dt className="inline font-medium">Started: </dt>
          <dd className="inline">{formatInstantDate(transfer.startedAt)}</dd>
        </div>
        {transfer.decidedAt && (
          <div>
            <dt className="inline font-medium">{mark.word}: </dt>
            <dd className="inline">{formatInstantDate(transfer.decidedAt)}</dd>
          </div>
        )}
        {transfer.toSiteName && (
          <div className="min-w-0 break-words">
            <dt className="inline font-medium">Now at: </dt>
            <dd className="inline">{transfer.toSiteName}</dd>
          </div>
        )}
      </dl>
      {transfer.note && (
        <p className="whitespace-pre-line break-words text-sm text-ink-800">
          <span className="font-medium">Note from the seller: </span>
          {transfer.note}
        </p>
      )}
      {transfer.declineReason && (
        <p className="whitespace-pre-line break-words text-sm text-ink-800">
          <span className="font-medium">Reason given: </span>
          {transfer.declineReason}
        </p>
      )}
      {transfer.sellerRecord && (
        <p className="break-words text-sm text-ink-700">
          Your record when it left: {transfer.sellerRecord.siteName}
          {transfer.sellerRecord.building ? `, ${transfer.sellerRecord.building}` : ""}
          {transfer.sellerRecord.bay ? `, ${transfer.sellerRecord.bay}` : ""}. You keep a read-only copy of
          its history up to {formatInstantDate(transfer.decidedAt)}.{" "}
          <Link
            to={hrefs.machineCopy(transfer.machineId)}
            className="text-ink-900 underline underline-offset-2"
          >
            Read your copy
          </Link>
        </p>
      )}
      {children}
    </article>
  );
}
