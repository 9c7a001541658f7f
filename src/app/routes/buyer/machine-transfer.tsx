import { useState } from "react";
import { Link, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { useQuery } from "@tanstack/react-query";
import { startTransferSchema } from "@shared/machines/transfers.ts";
import { technologyLabels } from "@shared/technicians/schemas.ts";
import { paths } from "@/config/paths.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { Spinner } from "@/components/ui/spinner.tsx";
import { Button } from "@/components/ui/button.tsx";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { queryClient } from "@/lib/query-client.ts";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { transfersOfMachineQuery } from "@/features/machines/api/get-machine-transfers.ts";
import { machineSummaryQuery } from "@/features/machines/api/get-machine-summary.ts";
import {
  useStartMachineTransfer,
  useWithdrawMachineTransfer,
} from "@/features/machines/api/decide-machine-transfer.ts";
import { TransferCard } from "@/features/machines/components/transfer-card.tsx";

const machineIdOf = (raw: string | undefined) => Number(raw);

export const loader = ({ params }: LoaderFunctionArgs) =>
  Promise.all([
    queryClient.ensureQueryData(machineSummaryQuery(machineIdOf(params.machineId))),
    queryClient.ensureQueryData(transfersOfMachineQuery(machineIdOf(params.machineId))),
  ]);

function StartTransferForm({ machineId }: { machineId: number }) {
  const start = useStartMachineTransfer();
  const [email, setEmail] = useState("");
  const [note, setNote] = useState("");
  const [clientError, setClientError] = useState<unknown>(null);
  const error = clientError ?? start.error;
  const fields = fieldErrorsOf(error);
  return (
    <form
      noValidate
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        const parsed = startTransferSchema.safeParse({ email, note: note.trim() || undefined });
        if (!parsed.success) return setClientError(parsed.error);
        setClientError(null);
        start.mutate({ machineId, input: parsed.data });
      }}
    >
      <TextField
        label="E-mail of a buyer at the buying shop"
        name="email"
        type="email"
        autoComplete="off"
        required
        value={email}
        error={fields["body.email"] ?? fields.email}
        hint="The shop must be on Clearbench; everyone who buys for it is told."
        onChange={(e) => setEmail(e.target.value)}
      />
      <TextAreaField
        label="Note to the buying shop (optional)"
        name="note"
        value={note}
        maxLength={1000}
        onChange={(e) => setNote(e.target.value)}
      />
      <FormError
        error={error}
        labels={{ "body.email": "E-mail of a buyer at the buying shop", email: "E-mail" }}
      />
      <Button type="submit" pending={start.isPending} pendingLabel="Starting…">
        Start transfer
      </Button>
    </form>
  );
}

export function Component() {
  const machineId = machineIdOf(useParams().machineId);
  const machine = useQuery(machineSummaryQuery(machineId));
  const transfers = useQuery(transfersOfMachineQuery(machineId));
  const withdraw = useWithdrawMachineTransfer();
  if (machine.isPending || transfers.isPending) return <Spinner label="Loading the machine" />;
  if (!machine.data)
    return (
      <>
        <PageHeader title="Transfer a machine" />
        <FormError error={machine.error} />
      </>
    );
  const m = machine.data;
  const list = transfers.data ?? [];
  const open = list.find((t) => t.state === "open" && t.side === "seller");
  return (
    <>
      <PageHeader
        title="Transfer a machine"
        description={
          <span className="break-words">
            {m.builder} {m.model} ({technologyLabels[m.technology]}, {m.controlFamily}), serial{" "}
            {m.serialNumber ?? "none recorded"}, at {m.siteName}.
          </span>
        }
        actions={
          <Link to={paths.buyer.machineTransfers} className={buttonStyles("secondary")}>
            All transfers
          </Link>
        }
      />
      <div className="max-w-2xl space-y-6">
        <section aria-labelledby="how-heading" className="space-y-2 text-sm text-ink-800">
          <h2 id="how-heading" className="text-lg font-semibold text-ink-900">
            What moves
          </h2>
          <p>
            When the buying shop accepts, the machine, its photos and its service history move to them. They
            see each past job's date, kind of work, service company, work done and parts; your prices,
            messages and people stay with you. You keep a read-only copy of the history up to the transfer
            date. Until they accept you may withdraw.
          </p>
        </section>
        {open ? (
          <section aria-labelledby="open-heading" className="space-y-3">
            <h2 id="open-heading" className="text-lg font-semibold text-ink-900">
              Waiting for the buying shop
            </h2>
            <TransferCard transfer={open}>
              <FormError error={withdraw.error} />
              <Button
                variant="danger"
                pending={withdraw.isPending}
                pendingLabel="Withdrawing…"
                onClick={() => {
                  if (window.confirm("Withdraw this transfer? The other shop can no longer accept it."))
                    withdraw.mutate(open.id);
                }}
              >
                Withdraw transfer
              </Button>
            </TransferCard>
          </section>
        ) : (
          <section aria-labelledby="start-heading" className="space-y-3">
            <h2 id="start-heading" className="text-lg font-semibold text-ink-900">
              Start a transfer
            </h2>
            <StartTransferForm machineId={machineId} />
          </section>
        )}
        {list.filter((t) => t !== open).length > 0 && (
          <section aria-labelledby="past-heading" className="space-y-3">
            <h2 id="past-heading" className="text-lg font-semibold text-ink-900">
              Earlier transfers
            </h2>
            {list
              .filter((t) => t !== open)
              .map((t) => (
                <TransferCard key={t.id} transfer={t} />
              ))}
          </section>
        )}
      </div>
    </>
  );
}
