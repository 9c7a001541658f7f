import { useState, type FormEvent } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { useNavigate } from "react-router-dom";
import {
  machineStateLabels,
  machineStates,
  requestKindLabels,
  requestKinds,
  type RoutingPreviewDto,
} from "@shared/service-requests/schemas.ts";
import { hrefs } from "@/config/paths.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { useRoster } from "@/features/roster/api/get-roster.ts";
import type { RosterEntryDto as RosterEntry } from "@shared/roster/schemas.ts";
import { requirementSetsQuery } from "@/features/standing/api/get-requirement-sets.ts";
import { useSiteEquipment } from "@/features/sites/api/get-site-equipment.ts";
import { sitesQuery } from "@/features/sites/api/get-sites.ts";
import {
  usePreviewServiceRequest,
  type ServiceRequestInput,
} from "@/features/service-requests/api/preview-service-request.ts";
import { useRaiseServiceRequest } from "@/features/service-requests/api/raise-service-request.ts";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { queryClient } from "@/lib/query-client.ts";
import { MAX_UPLOAD_SIZE_WORDS } from "@shared/credentials/upload-limits.ts";

export async function loader() {
  await Promise.all([
    queryClient.ensureQueryData(sitesQuery()),
    queryClient.ensureQueryData(requirementSetsQuery()),
  ]);
  return null;
}

/** The service companies on the shop's roster, once each, whether listed as a company or through a technician. */
function rosterCompanies(entries: RosterEntry[]) {
  const byId = new Map<number, string>();
  for (const e of entries) {
    const id = e.serviceCompanyId ?? e.technicians[0]?.companyId;
    if (id) byId.set(id, e.companyName);
  }
  return [...byId].map(([companyId, companyName]) => ({ companyId, companyName }));
}

const labels = { siteId: "Site", equipmentId: "Machine", problem: "What is wrong", windowEnd: "Last day" };

export function Component() {
  const navigate = useNavigate();
  const { data: sites } = useSuspenseQuery(sitesQuery());
  const { data: sets } = useSuspenseQuery(requirementSetsQuery());
  const [form, setForm] = useState({
    siteId: sites.length === 1 ? String(sites[0]!.id) : "",
    equipmentId: "",
    requirementSetId: "",
    kind: "repair",
    machineState: "down",
    timing: "soonest",
    windowStart: "",
    windowEnd: "",
    problem: "",
  });
  const [removed, setRemoved] = useState<number[]>([]);
  const [added, setAdded] = useState<number[]>([]);
  const roster = useRoster();
  const [files, setFiles] = useState<File[]>([]);
  const [preview, setPreview] = useState<RoutingPreviewDto | null>(null);
  const equipment = useSiteEquipment(form.siteId ? Number(form.siteId) : null);
  const check = usePreviewServiceRequest();
  const raise = useRaiseServiceRequest();
  const set = (name: keyof typeof form) => (e: { target: { value: string } }) => {
    setForm((f) => ({ ...f, [name]: e.target.value }));
    setPreview(null);
  };

  const input = (): ServiceRequestInput => ({
    siteId: Number(form.siteId),
    ...(form.equipmentId ? { equipmentId: Number(form.equipmentId) } : {}),
    requirementSetId: form.requirementSetId ? Number(form.requirementSetId) : null,
    kind: form.kind as ServiceRequestInput["kind"],
    machineState: form.machineState as ServiceRequestInput["machineState"],
    timing: form.timing as "soonest" | "window",
    ...(form.timing === "window" ? { windowStart: form.windowStart, windowEnd: form.windowEnd } : {}),
    problem: form.problem,
    removeCompanyIds: removed,
    addCompanyIds: added,
  });
  const errors = fieldErrorsOf(raise.error ?? check.error);

  function onPreview(addCompanyIds = added) {
    check.mutate({ ...input(), removeCompanyIds: [], addCompanyIds }, { onSuccess: (p) => setPreview(p) });
  }
  function onAdd(companyId: number) {
    const next = [...new Set([...added, companyId])];
    setAdded(next);
    setRemoved((r) => r.filter((id) => id !== companyId));
    onPreview(next);
  }
  const shown = new Set(preview?.companies.map((c) => c.companyId));
  const addable = rosterCompanies(roster.data ?? []).filter((c) => !shown.has(c.companyId));
  const nameOf = (id: number) =>
    rosterCompanies(roster.data ?? []).find((c) => c.companyId === id)?.companyName ?? `Company ${id}`;
  function onSubmit(e: FormEvent) {
    e.preventDefault();
    raise.mutate({ input: input(), files }, { onSuccess: (r) => navigate(hrefs.buyerServiceRequest(r.id)) });
  }
  const reach = preview ? preview.companies.filter((c) => !removed.includes(c.companyId)).length : null;

  return (
    <>
      <PageHeader
        title="New service request"
        description="Describe the problem once; every company with a technician cleared today for your requirements, who services this machine near the site, gets it."
      />
      <form onSubmit={onSubmit} className="max-w-2xl space-y-4" noValidate>
        <FormError error={raise.error ?? check.error} labels={labels} />
        <SelectField
          label="Site"
          name="siteId"
          value={form.siteId}
          onChange={set("siteId")}
          placeholder="Choose a site"
          options={sites.map((s) => ({ value: String(s.id), label: s.name }))}
          error={errors.siteId}
        />
        <SelectField
          label="Machine"
          name="equipmentId"
          value={form.equipmentId}
          onChange={set("equipmentId")}
          placeholder="Choose a machine"
          options={(equipment.data ?? []).map((m) => ({
            value: String(m.id),
            label: `${m.builder} ${m.model} (${m.controlFamily})`,
          }))}
          error={errors.equipmentId ?? errors.technology}
        />
        <SelectField
          label="Kind of work"
          name="kind"
          value={form.kind}
          onChange={set("kind")}
          options={requestKinds.map((k) => ({ value: k, label: requestKindLabels[k] }))}
        />
        <SelectField
          label="Machine state"
          name="machineState"
          value={form.machineState}
          onChange={set("machineState")}
          options={machineStates.map((k) => ({ value: k, label: machineStateLabels[k] }))}
        />
        <SelectField
          label="When"
          name="timing"
          value={form.timing}
          onChange={set("timing")}
          options={[
            { value: "soonest", label: "Soonest available" },
            { value: "window", label: "Between two dates" },
          ]}
        />
        {form.timing === "window" && (
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField
              label="First day"
              name="windowStart"
              type="date"
              value={form.windowStart}
              onChange={set("windowStart")}
              error={errors.windowStart}
            />
            <TextField
              label="Last day"
              name="windowEnd"
              type="date"
              value={form.windowEnd}
              onChange={set("windowEnd")}
              error={errors.windowEnd}
            />
          </div>
        )}
        <TextAreaField
          label="What is wrong"
          name="problem"
          rows={4}
          value={form.problem}
          onChange={set("problem")}
          hint="A few words are enough, e.g. 'won't power on'. Alarm numbers help."
          error={errors.problem}
        />
        <SelectField
          label="Requirement set"
          name="requirementSetId"
          value={form.requirementSetId}
          onChange={set("requirementSetId")}
          placeholder="Platform baseline"
          options={sets.map((s) => ({ value: String(s.id), label: s.name }))}
        />
        <TextField
          label="Photos or documents"
          name="file"
          type="file"
          multiple
          accept="image/png,image/jpeg,application/pdf,.xlsx,.csv"
          hint={`Photos (PNG, JPEG), PDFs or a maintenance log (.xlsx, .csv); ${MAX_UPLOAD_SIZE_WORDS} each at most, 2 MB for .csv.`}
          onChange={(e) => setFiles([...((e.target as HTMLInputElement).files ?? [])])}
        />
        <div className="space-y-2 rounded-md border border-ink-100 bg-ink-50 p-3">
          <Button variant="secondary" onClick={() => onPreview()} pending={check.isPending}>
            Check who it reaches
          </Button>
          {preview && (
            <>
              <p role="status" data-testid="reach-count">
                It will reach {reach} {reach === 1 ? "company" : "companies"}.
              </p>
              <ul className="space-y-1 text-sm">
                {preview.companies.map((c) => (
                  <li key={c.companyId}>
                    <label className="flex items-center gap-2">
                      <input
                        type="checkbox"
                        checked={!removed.includes(c.companyId)}
                        onChange={(e) =>
                          setRemoved((r) =>
                            e.target.checked ? r.filter((id) => id !== c.companyId) : [...r, c.companyId],
                          )
                        }
                      />
                      {c.companyName} · {c.clearedTechnicians} cleared
                      {c.nearestMiles !== null && ` · ${c.nearestMiles} mi`}
                      {c.oemTrained && " · builder-trained"}
                      {c.source === "buyer" && " · added from your roster"}
                    </label>
                  </li>
                ))}
              </ul>
              {preview.refused.length > 0 && (
                <ul role="alert" data-testid="refused-companies" className="space-y-1 text-sm text-red-900">
                  {preview.refused.map((r) => (
                    <li key={r.companyId}>
                      {nameOf(r.companyId)} cannot be invited: {r.reason}.
                    </li>
                  ))}
                </ul>
              )}
              {addable.length > 0 && (
                <SelectField
                  label="Add a company from your roster"
                  name="addCompany"
                  value=""
                  onChange={(e) => e.target.value && onAdd(Number(e.target.value))}
                  placeholder="Choose a company"
                  options={addable.map((c) => ({ value: String(c.companyId), label: c.companyName }))}
                  hint="Only a company with a technician cleared today for your requirements can be invited."
                />
              )}
            </>
          )}
        </div>
        <Button type="submit" pending={raise.isPending} pendingLabel="Sending…">
          Send request
        </Button>
      </form>
    </>
  );
}
