import { useState, type FormEvent } from "react";
import {
  acceptWorkOrderSchema,
  cancelWorkOrderSchema,
  completeWorkOrderSchema,
  declineWorkOrderSchema,
  disputeWorkOrderSchema,
  type WorkOrderDto as WorkOrder,
} from "@shared/work-orders/schemas.ts";
import { readPartLines } from "@shared/machines/service-history.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { useMoveWorkOrder } from "../api/move-work-order.ts";

const labels = {
  hoursWorked: "Hours worked on site",
  travelHours: "Travel hours, both ways",
  note: "Note for the shop",
  partsUsed: "Parts used",
  arrivalLocal: "Arrival at the site",
  proposedDate: "A date you could come instead",
  reason: "Reason",
};
const plainWords = {
  hoursWorked: "Enter the hours, e.g. 3.5",
  travelHours: "Enter the hours, e.g. 1.25",
  reason: "Say why (at least 5 characters)",
  arrivalLocal: "Enter the date and the time of arrival",
};

type Open = "accept" | "decline" | "complete" | "cancel" | "dispute" | null;

const hoursOf = (text: string) => (text.trim() === "" ? Number.NaN : Number(text.replace(",", ".")));
const textOf = (form: HTMLFormElement, name: string) => String(new FormData(form).get(name) ?? "").trim();

/** What the technician recorded, shown before the shop confirms or disputes it. */
function CompletionSummary({ workOrder }: { workOrder: WorkOrder }) {
  return (
    <div className="rounded-md border border-ink-100 bg-ink-50 p-3 text-sm" data-testid="completion-summary">
      <p className="font-medium text-ink-900">What the technician recorded</p>
      <dl className="mt-1 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1">
        <dt className="text-ink-700">On site</dt>
        <dd className="text-ink-900">{workOrder.hoursWorked ?? 0} h</dd>
        <dt className="text-ink-700">Travel</dt>
        <dd className="text-ink-900">{workOrder.travelHours ?? 0} h</dd>
        <dt className="text-ink-700">Note</dt>
        <dd className="whitespace-pre-line break-words text-ink-900">
          {workOrder.completionNote ?? "No note"}
        </dd>
      </dl>
    </div>
  );
}

/** Only the steps the server lists for the caller's side are offered; the server checks again on each. */
export function WorkOrderActions({ workOrder }: { workOrder: WorkOrder }) {
  const move = useMoveWorkOrder(workOrder.id);
  const [open, setOpen] = useState<Open>(null);
  const [invalid, setInvalid] = useState<unknown>(null);
  const problem = invalid ?? move.error;
  const errors = fieldErrorsOf(problem, plainWords);
  const { actions } = workOrder;
  const zone = typeof workOrder.site.timeZone === "string" ? workOrder.site.timeZone : null;
  if (actions.length === 0) return null;

  const close = () => {
    setOpen(null);
    setInvalid(null);
    move.reset();
  };
  const run = (parsed: { success: boolean; error?: unknown }, then: () => void) => {
    if (!parsed.success) return setInvalid(parsed.error);
    setInvalid(null);
    then();
  };
  const done = { onSuccess: () => setOpen(null) };

  const accept = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = acceptWorkOrderSchema.safeParse({
      arrivalLocal: textOf(event.currentTarget, "arrivalLocal"),
    });
    run(parsed, () => parsed.success && move.mutate({ action: "accept", input: parsed.data }, done));
  };
  const decline = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const proposedDate = textOf(event.currentTarget, "proposedDate");
    const parsed = declineWorkOrderSchema.safeParse({
      reason: textOf(event.currentTarget, "reason"),
      ...(proposedDate ? { proposedDate } : {}),
    });
    run(parsed, () => parsed.success && move.mutate({ action: "decline", input: parsed.data }, done));
  };
  const complete = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const note = textOf(event.currentTarget, "note");
    const parsed = completeWorkOrderSchema.safeParse({
      hoursWorked: hoursOf(textOf(event.currentTarget, "hoursWorked")),
      travelHours: hoursOf(textOf(event.currentTarget, "travelHours")),
      ...(note ? { note } : {}),
      partsUsed: readPartLines(textOf(event.currentTarget, "partsUsed")),
    });
    run(parsed, () => parsed.success && move.mutate({ action: "complete", input: parsed.data }, done));
  };
  const withReason = (action: "cancel" | "dispute") => (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const schema = action === "cancel" ? cancelWorkOrderSchema : disputeWorkOrderSchema;
    const parsed = schema.safeParse({ reason: textOf(event.currentTarget, "reason") });
    run(parsed, () => parsed.success && move.mutate({ action, reason: parsed.data.reason }, done));
  };
  const notNow = (
    <Button variant="quiet" onClick={close}>
      Not now
    </Button>
  );

  return (
    <section aria-labelledby="next-steps" className="space-y-3 rounded-lg border border-ink-100 bg-white p-4">
      <h2 id="next-steps" className="font-semibold text-ink-900">
        Next step
      </h2>
      <FormError error={problem} labels={labels} plainWords={plainWords} />
      {workOrder.status === "disputed" && (
        <p className="text-sm text-ink-700">
          {workOrder.yourSide === "shop"
            ? "You disputed this completion. Confirm once the open point is settled; the rating waits until then."
            : "The shop disputed this completion. Settle it in the messages, then record the completion again."}
        </p>
      )}
      {actions.includes("confirm") && <CompletionSummary workOrder={workOrder} />}
      {open === null && (
        <div className="flex flex-wrap gap-2">
          {actions.includes("accept") && <Button onClick={() => setOpen("accept")}>Accept…</Button>}
          {actions.includes("decline") && (
            <Button variant="danger" onClick={() => setOpen("decline")}>
              Decline…
            </Button>
          )}
          {actions.includes("complete") && (
            <Button onClick={() => setOpen("complete")}>
              {workOrder.status === "disputed" ? "Record the completion again…" : "Mark completed…"}
            </Button>
          )}
          {actions.includes("confirm") && (
            <Button
              pending={move.isPending && move.variables?.action === "confirm"}
              onClick={() => move.mutate({ action: "confirm" })}
            >
              Confirm the work is done
            </Button>
          )}
          {actions.includes("dispute") && (
            <Button variant="secondary" onClick={() => setOpen("dispute")}>
              Dispute…
            </Button>
          )}
          {actions.includes("cancel") && (
            <Button variant="danger" onClick={() => setOpen("cancel")}>
              Cancel the work order…
            </Button>
          )}
        </div>
      )}
      {open === "accept" && (
        <form noValidate onSubmit={accept} className="space-y-3" aria-label="Accept the work order">
          <TextField
            label={labels.arrivalLocal}
            name="arrivalLocal"
            type="datetime-local"
            hint={zone ? `The site's local time (${zone})` : "The site's local time"}
            error={errors.arrivalLocal}
          />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" pending={move.isPending}>
              Accept with this arrival
            </Button>
            {notNow}
          </div>
        </form>
      )}
      {open === "decline" && (
        <form noValidate onSubmit={decline} className="space-y-3" aria-label="Decline the work order">
          <TextField label="Reason for declining" name="reason" error={errors.reason} />
          <TextField
            label={labels.proposedDate}
            name="proposedDate"
            type="date"
            hint="Optional: the shop can take it with one click"
            error={errors.proposedDate}
          />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" variant="danger" pending={move.isPending}>
              Decline
            </Button>
            {notNow}
          </div>
        </form>
      )}
      {open === "complete" && (
        <form noValidate onSubmit={complete} className="space-y-3" aria-label="Record completion">
          <div className="grid gap-3 sm:grid-cols-2">
            <TextField
              label={labels.hoursWorked}
              name="hoursWorked"
              inputMode="decimal"
              error={errors.hoursWorked}
            />
            <TextField
              label={labels.travelHours}
              name="travelHours"
              inputMode="decimal"
              error={errors.travelHours}
            />
          </div>
          <TextField label={labels.note} name="note" hint="Optional" error={errors.note} />
          <TextAreaField
            label={labels.partsUsed}
            name="partsUsed"
            rows={2}
            hint="Optional; one part a line, e.g. 2 × Way wiper, WW-220"
            error={errors.partsUsed}
          />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" pending={move.isPending} pendingLabel="Saving">
              Record completion
            </Button>
            {notNow}
          </div>
        </form>
      )}
      {(open === "cancel" || open === "dispute") && (
        <form
          noValidate
          onSubmit={withReason(open)}
          className="space-y-3"
          aria-label={open === "cancel" ? "Cancel the work order" : "Dispute the completion"}
        >
          <TextAreaField
            label={open === "cancel" ? "Reason for cancelling" : "What is still open"}
            name="reason"
            rows={3}
            hint={
              open === "cancel"
                ? "The service company is told at once, by e-mail and in its notifications."
                : "Posted to the messages; the rating waits until you confirm."
            }
            error={errors.reason}
          />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" variant="danger" pending={move.isPending}>
              {open === "cancel" ? "Cancel the work order" : "Send the dispute"}
            </Button>
            {notNow}
          </div>
        </form>
      )}
    </section>
  );
}
