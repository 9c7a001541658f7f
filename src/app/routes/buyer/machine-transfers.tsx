import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { Spinner } from "@/components/ui/spinner.tsx";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { queryClient } from "@/lib/query-client.ts";
import type { MachineTransferDto } from "@shared/machines/transfers.ts";
import { sitesQuery } from "@/features/sites/api/get-sites.ts";
import { machineTransfersQuery } from "@/features/machines/api/get-machine-transfers.ts";
import {
  useAcceptMachineTransfer,
  useDeclineMachineTransfer,
  useWithdrawMachineTransfer,
} from "@/features/machines/api/decide-machine-transfer.ts";
import { TransferCard } from "@/features/machines/components/transfer-card.tsx";

export const loader = () => queryClient.ensureQueryData(machineTransfersQuery());

function AnswerTransfer({ transfer }: { transfer: MachineTransferDto }) {
  const sites = useQuery(sitesQuery());
  const accept = useAcceptMachineTransfer();
  const decline = useDeclineMachineTransfer();
  const [siteId, setSiteId] = useState("");
  const [building, setBuilding] = useState("");
  const [bay, setBay] = useState("");
  const [declining, setDeclining] = useState(false);
  const [reason, setReason] = useState("");
  const activeSites = (sites.data ?? []).filter((s) => s.active);

  if (declining)
    return (
      <form
        className="space-y-3 border-t border-ink-100 pt-3"
        onSubmit={(e) => {
          e.preventDefault();
          decline.mutate({ transferId: transfer.id, reason });
        }}
      >
        <TextAreaField
          label="Reason (optional, the seller sees it)"
          name="reason"
          value={reason}
          maxLength={1000}
          onChange={(e) => setReason(e.target.value)}
        />
        <FormError error={decline.error} />
        <div className="flex flex-wrap gap-2">
          <Button type="submit" variant="danger" pending={decline.isPending} pendingLabel="Declining…">
            Decline transfer
          </Button>
          <Button variant="secondary" onClick={() => setDeclining(false)}>
            Back
          </Button>
        </div>
      </form>
    );

  return (
    <form
      className="space-y-3 border-t border-ink-100 pt-3"
      onSubmit={(e) => {
        e.preventDefault();
        accept.mutate({
          transferId: transfer.id,
          input: { siteId: Number(siteId), building: building.trim() || null, bay: bay.trim() || null },
        });
      }}
    >
      <p className="text-sm text-ink-800">
        Accepting moves the machine, its photos and its service history to your shop. You will see each past
        job's date, kind of work, service company, work done and parts; the seller's prices, messages and
        people stay with the seller.
      </p>
      <SelectField
        label="Your site for this machine"
        name="siteId"
        required
        placeholder={sites.isPending ? "Loading your sites…" : "Choose a site"}
        options={activeSites.map((s) => ({ value: String(s.id), label: s.name }))}
        value={siteId}
        onChange={(e) => setSiteId(e.target.value)}
      />
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          label="Building (optional)"
          name="building"
          value={building}
          maxLength={80}
          onChange={(e) => setBuilding(e.target.value)}
        />
        <TextField
          label="Bay (optional)"
          name="bay"
          value={bay}
          maxLength={40}
          onChange={(e) => setBay(e.target.value)}
        />
      </div>
      <FormError error={accept.error} labels={{ "body.siteId": "Your site for this machine" }} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={siteId === ""} pending={accept.isPending} pendingLabel="Taking over…">
          Accept transfer
        </Button>
        <Button variant="secondary" onClick={() => setDeclining(true)}>
          Decline…
        </Button>
      </div>
    </form>
  );
}

function WithdrawTransfer({ transfer }: { transfer: MachineTransferDto }) {
  const withdraw = useWithdrawMachineTransfer();
  return (
    <div className="space-y-2 border-t border-ink-100 pt-3">
      <FormError error={withdraw.error} />
      <Button
        variant="danger"
        pending={withdraw.isPending}
        pendingLabel="Withdrawing…"
        onClick={() => {
          if (window.confirm("Withdraw this transfer? The other shop can no longer accept it."))
            withdraw.mutate(transfer.id);
        }}
      >
        Withdraw transfer
      </Button>
    </div>
  );
}

export function Component() {
  const transfers = useQuery(machineTransfersQuery());
  if (transfers.isPending) return <Spinner label="Loading transfers" />;
  const { incoming = [], outgoing = [] } = transfers.data ?? {};
  return (
    <>
      <PageHeader
        title="Machine transfers"
        description="Machines changing hands between shops. A machine moves, with its photos and service history, only when the receiving shop accepts."
      />
      <FormError error={transfers.error} />
      <div className="space-y-8">
        <section aria-labelledby="incoming-heading" className="space-y-3">
          <h2 id="incoming-heading" className="text-lg font-semibold text-ink-900">
            Coming to you
          </h2>
          {incoming.length === 0 ? (
            <EmptyState title="No machines are being transferred to you">
              When another shop sells you a machine, it starts a transfer to your e-mail and it appears here.
            </EmptyState>
          ) : (
            incoming.map((t) => (
              <TransferCard key={t.id} transfer={t}>
                {t.actions.includes("accept") && <AnswerTransfer transfer={t} />}
              </TransferCard>
            ))
          )}
        </section>
        <section aria-labelledby="outgoing-heading" className="space-y-3">
          <h2 id="outgoing-heading" className="text-lg font-semibold text-ink-900">
            Sent by you
          </h2>
          {outgoing.length === 0 ? (
            <EmptyState title="You have not transferred a machine">
              Start a transfer from a machine you sold; the buying shop accepts it here.
            </EmptyState>
          ) : (
            outgoing.map((t) => (
              <TransferCard key={t.id} transfer={t}>
                {t.actions.includes("withdraw") && <WithdrawTransfer transfer={t} />}
              </TransferCard>
            ))
          )}
        </section>
      </div>
    </>
  );
}
