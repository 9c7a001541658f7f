import { useEffect, useRef, useState, type FormEvent } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link, useNavigate, useSearchParams } from "react-router-dom";
import {
  dueStateWords,
  hourReadingInputSchema,
  type MaintenancePlanDto,
  type MaintenancePlanListDto,
} from "@shared/machines/maintenance-schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { Spinner } from "@/components/ui/spinner.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { hrefs } from "@/config/paths.ts";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { formatIsoDate } from "@/lib/format-date.ts";
import { readForm } from "@/lib/read-form.ts";
import { maintenancePlansQuery } from "../api/maintenance-keys.ts";
import { useRecordHourReading } from "../api/record-hour-reading.ts";
import { useRemoveMaintenancePlan } from "../api/remove-maintenance-plan.ts";
import { useRequestPlannedService } from "../api/request-planned-service.ts";
import { useSaveMaintenancePlan } from "../api/save-maintenance-plan.ts";
import { MaintenancePlanForm } from "./maintenance-plan-form.tsx";

const readerZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone;
const hours = (n: number) => `${n.toLocaleString("en-US")} h`;

function intervalWords(plan: MaintenancePlanDto) {
  if (plan.intervalKind === "hours") return `Every ${hours(plan.intervalHours!)} of running`;
  return plan.intervalMonths === 1 ? "Every month" : `Every ${plan.intervalMonths} months`;
}

function lastDoneWords(plan: MaintenancePlanDto) {
  if (plan.intervalKind === "hours") return `Last done at ${hours(plan.lastDoneHours!)}`;
  return `Last done ${formatIsoDate(plan.lastDoneOn)}`;
}

function whenWords(plan: MaintenancePlanDto) {
  const { due } = plan;
  if (due.daysUntil === null) return `Due at ${hours(due.dueHours!)}; record meter readings to see a date`;
  const on = due.dueOn ? `${due.estimated ? "projected for " : ""}${formatIsoDate(due.dueOn)}` : "";
  if (due.daysUntil < 0) return `${-due.daysUntil} days overdue (${on})`;
  if (due.daysUntil === 0)
    return `Due now${due.dueHours !== null ? ` (${hours(due.dueHours)} reached)` : ""}`;
  return `Due in ${due.daysUntil} ${due.daysUntil === 1 ? "day" : "days"}, ${on}`;
}

const stateStyles: Record<MaintenancePlanDto["due"]["state"], string> = {
  scheduled: "border-ink-300 text-ink-700",
  coming_due: "border-amber-700 text-amber-800",
  due_soon: "border-amber-700 bg-amber-50 text-amber-900",
  due_now: "border-red-700 bg-red-50 text-red-800",
  overdue: "border-red-700 bg-red-50 text-red-800",
};

type PlanCardProps = { plan: MaintenancePlanDto; list: MaintenancePlanListDto; named: boolean };

function PlanCard({ plan, list, named }: PlanCardProps) {
  const [editing, setEditing] = useState(false);
  const cardRef = useRef<HTMLLIElement>(null);
  // A reminder links to its plan (?plan=12): bring that one into view.
  useEffect(() => {
    if (named) cardRef.current?.scrollIntoView({ block: "center" });
  }, [named]);
  const [confirmingDelete, setConfirmingDelete] = useState(false);
  const save = useSaveMaintenancePlan(plan.machineId);
  const remove = useRemoveMaintenancePlan(plan.machineId);
  const raise = useRequestPlannedService(plan.machineId);
  const navigate = useNavigate();
  const otherZone = plan.dueStartsAt && readerZone() !== list.siteTimeZone;

  if (editing)
    return (
      <li className="rounded-lg border border-ink-100 bg-white p-4">
        <MaintenancePlanForm
          plan={plan}
          pending={save.isPending}
          serverError={save.error}
          onSubmit={(input) =>
            save.mutate(
              { machineId: plan.machineId, planId: plan.id, input },
              { onSuccess: () => setEditing(false) },
            )
          }
          onCancel={() => setEditing(false)}
        />
      </li>
    );

  return (
    <li
      ref={cardRef}
      className={`space-y-3 rounded-lg border bg-white p-4 ${named ? "border-ink-700 ring-2 ring-ink-700/30" : "border-ink-100"}`}
      aria-label={plan.name}
      aria-current={named || undefined}
    >
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="min-w-0">
          <h3 className="font-semibold break-words text-ink-900">{plan.name}</h3>
          <p className="text-sm text-ink-700">
            {intervalWords(plan)} · {lastDoneWords(plan)}
          </p>
        </div>
        <span
          className={`rounded-full border px-2 py-0.5 text-xs font-semibold ${stateStyles[plan.due.state]}`}
        >
          {dueStateWords[plan.due.state]}
        </span>
      </div>
      <p className="text-ink-900" data-testid="next-due">
        {whenWords(plan)}
        {otherZone && (
          <span className="block text-sm text-ink-700">
            The day starts at the site at {formatDateTime(plan.dueStartsAt!)} your time.
          </span>
        )}
      </p>
      {plan.openRequest ? (
        <p className="text-sm text-ink-700">
          <Link
            className="font-semibold text-ink-900 underline"
            to={hrefs.buyerServiceRequest(plan.openRequest.serviceRequestId)}
          >
            Service request #{plan.openRequest.serviceRequestId}
          </Link>{" "}
          asks for {formatIsoDate(plan.openRequest.windowStart)} to{" "}
          {formatIsoDate(plan.openRequest.windowEnd)} (raised {formatDateTime(plan.openRequest.createdAt)}).
        </p>
      ) : null}
      <FormError error={raise.error ?? remove.error} />
      <div className="flex flex-wrap gap-2">
        {!plan.openRequest && (
          <Button
            // The accent marks the one thing to do next: only on plans that are coming due.
            variant={plan.due.state === "scheduled" ? "secondary" : "primary"}
            pending={raise.isPending}
            pendingLabel="Raising the request"
            onClick={() =>
              raise.mutate(
                { machineId: plan.machineId, planId: plan.id },
                { onSuccess: (r) => navigate(hrefs.buyerServiceRequest(r.serviceRequestId)) },
              )
            }
          >
            Request this service
          </Button>
        )}
        <Button variant="secondary" onClick={() => setEditing(true)}>
          Edit
        </Button>
        {confirmingDelete ? (
          <>
            <Button
              variant="danger"
              pending={remove.isPending}
              pendingLabel="Deleting"
              onClick={() => remove.mutate({ machineId: plan.machineId, planId: plan.id })}
            >
              Delete {plan.name}
            </Button>
            <Button variant="quiet" onClick={() => setConfirmingDelete(false)}>
              Keep it
            </Button>
          </>
        ) : (
          <Button variant="quiet" onClick={() => setConfirmingDelete(true)}>
            Delete
          </Button>
        )}
      </div>
    </li>
  );
}

function MeterReading({ list }: { list: MaintenancePlanListDto }) {
  const record = useRecordHourReading(list.machineId);
  const [invalid, setInvalid] = useState<unknown>(null);
  const problem = invalid ?? record.error;
  const fields = fieldErrorsOf(problem);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const values = readForm(form);
    const parsed = hourReadingInputSchema.safeParse({
      hours: values.hours?.trim() ? Number(values.hours) : undefined,
      readOn: values.readOn || undefined,
    });
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    record.mutate({ machineId: list.machineId, input: parsed.data }, { onSuccess: () => form.reset() });
  };

  return (
    <section
      aria-labelledby="meter-heading"
      className="space-y-3 rounded-lg border border-ink-100 bg-white p-4"
    >
      <h2 id="meter-heading" className="font-semibold text-ink-900">
        Running-hours meter
      </h2>
      <p className="text-sm text-ink-700">
        {list.latestReading
          ? `Last read ${hours(list.latestReading.hours)} on ${formatIsoDate(list.latestReading.readOn)} (entered ${formatDateTime(list.latestReading.recordedAt)}).`
          : "No reading yet. Plans in running hours show a projected date once two readings a week or more apart are in."}
      </p>
      <form noValidate onSubmit={submit} className="space-y-3" aria-label="Record meter hours">
        <FormError error={problem} labels={{ hours: "Meter hours", readOn: "Read on" }} />
        <div className="grid gap-3 sm:grid-cols-3">
          <TextField
            label="Meter hours"
            name="hours"
            type="number"
            inputMode="numeric"
            min={0}
            error={fields.hours}
          />
          <TextField
            label="Read on"
            name="readOn"
            type="date"
            hint="Today when left empty"
            error={fields.readOn}
          />
        </div>
        <Button type="submit" variant="secondary" pending={record.isPending} pendingLabel="Saving">
          Record reading
        </Button>
      </form>
    </section>
  );
}

/** A machine's maintenance plans: when each falls due, and the one click that asks cleared companies to do it. */
export function MaintenancePlansPanel({ machineId }: { machineId: number }) {
  const { data: list, isPending, error } = useQuery(maintenancePlansQuery(machineId));
  const [adding, setAdding] = useState(false);
  const save = useSaveMaintenancePlan(machineId);
  const [search] = useSearchParams();
  const namedPlanId = Number(search.get("plan"));

  if (isPending) return <Spinner label="Loading maintenance plans" />;
  if (error || !list) return <FormError error={error} />;

  return (
    <div className="min-w-0 space-y-6">
      <section aria-labelledby="plans-heading" className="space-y-3">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="plans-heading" className="text-lg font-semibold text-ink-900">
            Plans
          </h2>
          {!adding && (
            <Button variant="secondary" onClick={() => setAdding(true)}>
              Add a plan
            </Button>
          )}
        </div>
        <p className="text-sm text-ink-700">
          Due dates follow the calendar at the machine's site. The shop's buyers are reminded 30 and 7 days
          ahead.
        </p>
        {adding && (
          <div className="rounded-lg border border-ink-100 bg-white p-4">
            <MaintenancePlanForm
              pending={save.isPending}
              serverError={save.error}
              onSubmit={(input) => save.mutate({ machineId, input }, { onSuccess: () => setAdding(false) })}
              onCancel={() => setAdding(false)}
            />
          </div>
        )}
        {list.plans.length === 0 && !adding ? (
          <EmptyState title="No maintenance plans yet">
            Add what this machine needs and how often, such as an annual inspection, a six-month way lube and
            backlash check or a ballbar test.
          </EmptyState>
        ) : (
          <ul className="space-y-3">
            {list.plans.map((plan) => (
              <PlanCard key={plan.id} plan={plan} list={list} named={plan.id === namedPlanId} />
            ))}
          </ul>
        )}
      </section>
      <MeterReading list={list} />
    </div>
  );
}
