import { useState } from "react";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField, type SelectOption } from "@/components/ui/select-field.tsx";
import { formatIsoDate } from "@/lib/format-date.ts";
import { useSendWorkOrderAgain } from "../api/send-work-order-again.ts";
import type { WorkOrderDto as WorkOrder } from "@shared/work-orders/schemas.ts";

type SendAgainPanelProps = {
  workOrder: WorkOrder;
  /** Technicians the shop may see and who are cleared for this site now; the server checks again. */
  choices: readonly SelectOption[];
  onSent: (newId: number) => void;
};

/** After a decline: take the date the technician proposed, or copy the job to another technician. */
export function SendAgainPanel({ workOrder, choices, onSent }: SendAgainPanelProps) {
  const send = useSendWorkOrderAgain(workOrder.id);
  const [technicianId, setTechnicianId] = useState("");
  const [missing, setMissing] = useState(false);
  const proposed = workOrder.proposedDate;
  return (
    <section aria-labelledby="send-again" className="space-y-3 rounded-lg border border-ink-100 bg-white p-4">
      <h2 id="send-again" className="font-semibold text-ink-900">
        Send the job on
      </h2>
      <FormError error={send.error} labels={{ technicianId: "Technician" }} />
      {proposed && (
        <div className="space-y-2">
          <p className="text-sm text-ink-900">
            {workOrder.technician.name} proposed <strong>{formatIsoDate(proposed)}</strong> instead.
          </p>
          <Button
            pending={send.isPending && send.variables?.technicianId === workOrder.technician.id}
            onClick={() =>
              send.mutate(
                { technicianId: workOrder.technician.id, preferredDates: [proposed] },
                { onSuccess: (copy) => onSent(copy.id) },
              )
            }
          >
            Take {formatIsoDate(proposed)}
          </Button>
        </div>
      )}
      <form
        noValidate
        className="space-y-3"
        aria-label="Send to another technician"
        onSubmit={(event) => {
          event.preventDefault();
          if (!technicianId) return setMissing(true);
          setMissing(false);
          send.mutate({ technicianId: Number(technicianId) }, { onSuccess: (copy) => onSent(copy.id) });
        }}
      >
        <SelectField
          label="Another technician"
          name="technicianId"
          options={choices}
          placeholder={choices.length === 0 ? "No other cleared technician near this site" : "Choose"}
          disabled={choices.length === 0}
          value={technicianId}
          onChange={(e) => setTechnicianId(e.target.value)}
          hint="The same site, machine, problem and on-site details are copied into a new work order."
          error={missing ? "Choose a technician" : undefined}
        />
        <Button
          type="submit"
          variant="secondary"
          disabled={choices.length === 0}
          pending={send.isPending && send.variables?.technicianId !== workOrder.technician.id}
        >
          Send to this technician
        </Button>
      </form>
    </section>
  );
}
