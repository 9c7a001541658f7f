import { useState, type FormEvent } from "react";
import { completeWorkOrderSchema, declineWorkOrderSchema } from "@shared/work-orders/schemas.ts";
import { readPartLines } from "@shared/machines/service-history.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { useMoveWorkOrder } from "../api/move-work-order.ts";
import type { WorkOrder } from "../api/work-order-shapes.ts";

const completeLabels = {
  hoursWorked: "Hours worked on site",
  travelHours: "Travel hours, both ways",
  note: "Note for the shop",
  partsUsed: "Parts used",
};
const plainWords = {
  hoursWorked: "Enter the hours, e.g. 3.5",
  travelHours: "Enter the hours, e.g. 1.25",
  reason: "Say why (at least 5 characters)",
};

const hoursOf = (text: string) => (text.trim() === "" ? Number.NaN : Number(text.replace(",", ".")));

/** Only the steps the server lists for the caller's side are offered; the server checks again on each. */
export function WorkOrderActions({ workOrder }: { workOrder: WorkOrder }) {
  const move = useMoveWorkOrder(workOrder.id);
  const [open, setOpen] = useState<"decline" | "complete" | null>(null);
  const [invalid, setInvalid] = useState<unknown>(null);
  const problem = invalid ?? move.error;
  const errors = fieldErrorsOf(problem, plainWords);
  const { actions } = workOrder;
  if (actions.length === 0) return null;

  const decline = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = declineWorkOrderSchema.safeParse({
      reason: String(new FormData(event.currentTarget).get("reason") ?? ""),
    });
    if (!parsed.success) return setInvalid(parsed.error);
    setInvalid(null);
    move.mutate({ action: "decline", reason: parsed.data.reason }, { onSuccess: () => setOpen(null) });
  };
  const complete = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const note = String(data.get("note") ?? "").trim();
    const parsed = completeWorkOrderSchema.safeParse({
      hoursWorked: hoursOf(String(data.get("hoursWorked") ?? "")),
      travelHours: hoursOf(String(data.get("travelHours") ?? "")),
      ...(note ? { note } : {}),
      partsUsed: readPartLines(String(data.get("partsUsed") ?? "")),
    });
    if (!parsed.success) return setInvalid(parsed.error);
    setInvalid(null);
    move.mutate({ action: "complete", input: parsed.data }, { onSuccess: () => setOpen(null) });
  };

  return (
    <section aria-labelledby="next-steps" className="space-y-3 rounded-lg border border-ink-100 bg-white p-4">
      <h2 id="next-steps" className="font-semibold text-ink-900">
        Next step
      </h2>
      <FormError error={problem} labels={{ ...completeLabels, reason: "Reason" }} plainWords={plainWords} />
      <div className="flex flex-wrap gap-2">
        {actions.includes("accept") && (
          <Button
            pending={move.isPending && move.variables?.action === "accept"}
            onClick={() => move.mutate({ action: "accept" })}
          >
            Accept
          </Button>
        )}
        {actions.includes("decline") && open !== "decline" && (
          <Button variant="danger" onClick={() => setOpen("decline")}>
            Decline…
          </Button>
        )}
        {actions.includes("complete") && open !== "complete" && (
          <Button onClick={() => setOpen("complete")}>Mark completed…</Button>
        )}
        {actions.includes("confirm") && (
          <Button
            pending={move.isPending && move.variables?.action === "confirm"}
            onClick={() => move.mutate({ action: "confirm" })}
          >
            Confirm the work is done
          </Button>
        )}
      </div>
      {open === "decline" && (
        <form noValidate onSubmit={decline} className="space-y-3" aria-label="Decline the work order">
          <TextField label="Reason for declining" name="reason" error={errors.reason} />
          <div className="flex gap-2">
            <Button type="submit" variant="danger" pending={move.isPending}>
              Decline
            </Button>
            <Button variant="quiet" onClick={() => setOpen(null)}>
              Cancel
            </Button>
          </div>
        </form>
      )}
      {open === "complete" && (
        <form noValidate onSubmit={complete} className="space-y-3" aria-label="Record completion">
          <div className="grid gap-3 sm:grid-cols-2">
            <TextField
              label={completeLabels.hoursWorked}
              name="hoursWorked"
              inputMode="decimal"
              error={errors.hoursWorked}
            />
            <TextField
              label={completeLabels.travelHours}
              name="travelHours"
              inputMode="decimal"
              error={errors.travelHours}
            />
          </div>
          <TextField label={completeLabels.note} name="note" hint="Optional" error={errors.note} />
          <TextAreaField
            label={completeLabels.partsUsed}
            name="partsUsed"
            rows={2}
            hint="Optional; one part a line, e.g. 2 × Way wiper, WW-220"
            error={errors.partsUsed}
          />
          <div className="flex gap-2">
            <Button type="submit" pending={move.isPending} pendingLabel="Saving">
              Record completion
            </Button>
            <Button variant="quiet" onClick={() => setOpen(null)}>
              Cancel
            </Button>
          </div>
        </form>
      )}
    </section>
  );
}
