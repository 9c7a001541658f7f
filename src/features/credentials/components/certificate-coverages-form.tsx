import { useMemo, useState, type FormEvent } from "react";
import { LOW_CONFIDENCE } from "@shared/credentials/locate-values.ts";
import { isApiError } from "@/lib/api-client.ts";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import type {
  CredentialDto as Credential,
  ProposedCoverageDto as ProposedCoverage,
  UploadedDocumentDto as UploadedDocument,
} from "@shared/credentials/credential-shapes.ts";
import { useSubmitCoverages } from "../api/submit-coverages.ts";
import { CredentialFieldsForm } from "./credential-fields-form.tsx";
import { fieldDefinitionsFor } from "./field-definitions.ts";
import { problemsAsError } from "./field-problems.ts";
import { parseFieldValues, toFieldValues, type FieldValues } from "./field-values.ts";
import { ReviewerWarnings } from "./reviewer-warnings.tsx";

// Printed once for the whole certificate, so they are asked once and copied into every coverage sent.
const PARTY_PATHS = ["namedInsured", "certificateHolder"] as const;

const definitionsOf = (typeCode: string) =>
  fieldDefinitionsFor("insurance", typeCode).filter(
    (d) => !(PARTY_PATHS as readonly string[]).includes(d.path),
  );

type CoverageState = { values: FieldValues; send: boolean; problems: Record<string, string> };

const REQUIRED_READS = ["insurerName", "policyNumber", "effectiveDate", "expirationDate"];
const missingReads = (coverage: ProposedCoverage) =>
  REQUIRED_READS.filter((path) => !coverage.found.includes(path)).length;

/**
 * Every coverage read from one certificate of insurance on one form: the uploader corrects each, leaves out any
 * that should not be sent, and sends the rest together (the server saves all of them or none).
 */
export function CertificateCoveragesForm({
  uploaded,
  onSubmitted,
}: {
  uploaded: UploadedDocument & { certificate: NonNullable<UploadedDocument["certificate"]> };
  onSubmitted: (credentials: Credential[]) => void;
}) {
  const coverages = uploaded.certificate.coverages;
  const [parties, setParties] = useState<Record<string, string>>(() => ({
    namedInsured: uploaded.certificate.parties.namedInsured ?? "",
    certificateHolder: uploaded.certificate.parties.certificateHolder ?? "",
  }));
  const [states, setStates] = useState<CoverageState[]>(() =>
    coverages.map((c) => ({
      values: toFieldValues(definitionsOf(c.typeCode), c.fields),
      send: true,
      problems: {},
    })),
  );
  const [summary, setSummary] = useState<unknown>(null);
  const submit = useSubmitCoverages();
  const definitions = useMemo(() => coverages.map((c) => definitionsOf(c.typeCode)), [coverages]);

  const update = (index: number, change: Partial<CoverageState>) =>
    setStates((current) => current.map((s, i) => (i === index ? { ...s, ...change } : s)));

  const send = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const chosen = states.flatMap((state, index) => (state.send ? [index] : []));
    if (chosen.length === 0) {
      setSummary(problemsAsError("Keep at least one coverage to send, or use another file.", {}));
      return;
    }
    const partyFields = Object.fromEntries(
      Object.entries(parties)
        .map(([key, value]) => [key, value.trim()])
        .filter(([, value]) => value !== ""),
    );
    let failed = false;
    const next = states.map((state) => ({ ...state, problems: {} as Record<string, string> }));
    const credentials = chosen.flatMap((index) => {
      const parsed = parseFieldValues("insurance", definitions[index]!, states[index]!.values);
      if (!parsed.ok) {
        failed = true;
        next[index]!.problems = parsed.problems;
        return [];
      }
      return [{ typeCode: coverages[index]!.typeCode, fields: { ...parsed.fields, ...partyFields } }];
    });
    setStates(next);
    if (failed) {
      setSummary(problemsAsError("Check the coverages marked below, or leave them out.", {}));
      return;
    }
    setSummary(null);
    submit.mutate(
      { documentId: uploaded.document.id, credentials },
      {
        onSuccess: (result) => onSubmitted(result.credentials),
        onError: (error) => {
          // The server names "credentials.N.fields.x", N counted over the coverages sent.
          const byField = fieldErrorsOf(error);
          const mapped = states.map((state) => ({ ...state, problems: {} as Record<string, string> }));
          for (const [path, message] of Object.entries(byField)) {
            const match = /^credentials\.(\d+)\.fields\.(.+)$/.exec(path);
            const index = match ? chosen[Number(match[1])] : undefined;
            if (index !== undefined) mapped[index]!.problems[match![2]!] = message;
          }
          setStates(mapped);
          setSummary(isApiError(error) ? problemsAsError(error.message, {}) : error);
        },
      },
    );
  };

  const sending = states.filter((s) => s.send).length;

  return (
    <form noValidate onSubmit={send} className="space-y-6" aria-label="Check the coverages">
      <p
        role="status"
        className="rounded-md border-l-4 border-ink-500 bg-ink-50 px-4 py-3 text-sm text-ink-900"
      >
        {coverages.length} {coverages.length === 1 ? "coverage was" : "coverages were"} found on this
        certificate. Each becomes its own credential, verified on its own. Fields read from the document are
        marked; check each against the certificate, and leave out any coverage you do not want to send.
      </p>
      <FormError error={summary} />
      <fieldset className="grid gap-4 rounded-md border border-ink-100 p-4 sm:grid-cols-2">
        <legend className="px-1 text-sm font-semibold text-ink-900">Printed once for the certificate</legend>
        {uploaded.certificate.parties.producer && (
          <p className="text-sm text-ink-700 sm:col-span-2">
            Producer: {uploaded.certificate.parties.producer}
          </p>
        )}
        <TextField
          label="Named insured"
          name="namedInsured"
          value={parties.namedInsured ?? ""}
          onChange={(event) => setParties((p) => ({ ...p, namedInsured: event.currentTarget.value }))}
          disabled={submit.isPending}
        />
        <TextField
          label="Certificate holder"
          name="certificateHolder"
          value={parties.certificateHolder ?? ""}
          onChange={(event) => setParties((p) => ({ ...p, certificateHolder: event.currentTarget.value }))}
          disabled={submit.isPending}
        />
      </fieldset>
      {coverages.map((coverage, index) => {
        const state = states[index]!;
        const headingId = `coverage-${coverage.typeCode}`;
        const missing = missingReads(coverage);
        return (
          <section
            key={coverage.typeCode}
            aria-labelledby={headingId}
            className="space-y-4 rounded-lg border border-ink-200 bg-white p-4"
          >
            <div className="flex flex-wrap items-center justify-between gap-3">
              <h2 id={headingId} className="text-lg font-semibold text-ink-900">
                {coverage.typeName}
              </h2>
              <label className="flex min-h-11 items-center gap-2 text-sm font-medium text-ink-900">
                <input
                  type="checkbox"
                  className="size-5 accent-ink-700"
                  checked={state.send}
                  onChange={(event) => update(index, { send: event.currentTarget.checked })}
                  disabled={submit.isPending}
                />
                Send {coverage.typeName.toLowerCase()}
              </label>
            </div>
            {missing > 0 && (
              <p className="text-sm text-ink-700">
                {missing} required {missing === 1 ? "field" : "fields"} could not be read: fill them from the
                certificate, or leave this coverage out.
              </p>
            )}
            {state.send && (
              <>
                <ReviewerWarnings warnings={coverage.warnings} title="The reviewer will look at these" />
                <CredentialFieldsForm
                  definitions={definitions[index]!}
                  values={state.values}
                  onChange={(path, value) => update(index, { values: { ...state.values, [path]: value } })}
                  errors={state.problems}
                  found={new Set(coverage.found)}
                  lowConfidence={
                    new Set(
                      Object.entries(coverage.evidence)
                        .filter(([, e]) => e.confidence < LOW_CONFIDENCE)
                        .map(([path]) => path),
                    )
                  }
                  disabled={submit.isPending}
                />
              </>
            )}
          </section>
        );
      })}
      <div className="flex flex-wrap gap-3 border-t border-ink-100 pt-4">
        <Button type="submit" pending={submit.isPending} pendingLabel="Sending…" className="min-h-12">
          Send {sending} {sending === 1 ? "coverage" : "coverages"} for verification
        </Button>
      </div>
    </form>
  );
}
