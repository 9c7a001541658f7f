import { useMemo, useState, type FormEvent } from "react";
import { isApiError } from "@/lib/api-client.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import type {
  CredentialDto as Credential,
  CredentialTypeDto as CredentialType,
  UploadedDocumentDto as UploadedDocument,
} from "@shared/credentials/credential-shapes.ts";
import { useSubmitCredential } from "../api/submit-credential.ts";
import { useUploadDocument } from "../api/upload-document.ts";
import { CertificateCoveragesForm } from "./certificate-coverages-form.tsx";
import { CredentialFieldsForm } from "./credential-fields-form.tsx";
import { CredentialTypeSelect } from "./credential-type-select.tsx";
import { ExtractionNote } from "./extraction-note.tsx";
import { fieldDefinitionsFor } from "./field-definitions.ts";
import { credentialFieldErrorsOf, labelsOf, problemsAsError } from "./field-problems.ts";
import { parseFieldValues, toFieldValues, type FieldValues } from "./field-values.ts";
import { DocumentViewer } from "./document-viewer.tsx";
import { FileDrop } from "./file-drop.tsx";
import { ReviewerWarnings } from "./reviewer-warnings.tsx";
import { UploadProgress } from "./upload-progress.tsx";
import { formatFileSize } from "@/lib/format-file-size.ts";
import { TypeCaution } from "./type-caution.tsx";
import { NamedTechniciansChecklist } from "./named-technicians-checklist.tsx";
import { MAX_UPLOAD_SIZE_WORDS } from "@shared/credentials/upload-limits.ts";

export type HolderOption = { id: number; name: string };

type UploadFlowProps = {
  /** The types this person may upload (active ones, and for a technician only their own card types). */
  types: readonly CredentialType[];
  /** Technicians to choose from for technician-held types. */
  technicians: readonly HolderOption[];
  /** A technician uploading their own card: the holder is fixed. */
  fixedTechnicianId?: number | undefined;
  initialTypeCode?: string | undefined;
  initialTechnicianId?: number | undefined;
  onSubmitted: (credential: Credential) => void;
  /** Every coverage sent from one certificate; without it the first stands for all. */
  onCoveragesSubmitted?: (credentials: Credential[]) => void;
};

const uploadProblem = (error: unknown): string => {
  if (!isApiError(error)) return "The upload failed. Try again.";
  if (error.status === 413) return error.message || `That file is larger than ${MAX_UPLOAD_SIZE_WORDS}.`;
  return error.message;
};

/** Choose the type and holder, send the file, check the fields read from it, then submit it for verification. */
export function UploadFlow({
  types,
  technicians,
  fixedTechnicianId,
  initialTypeCode,
  initialTechnicianId,
  onSubmitted,
  onCoveragesSubmitted,
}: UploadFlowProps) {
  const [typeCode, setTypeCode] = useState(
    types.some((t) => t.code === initialTypeCode) ? (initialTypeCode ?? "") : "",
  );
  const [technicianId, setTechnicianId] = useState(initialTechnicianId ? String(initialTechnicianId) : "");
  const [choiceProblems, setChoiceProblems] = useState<Record<string, string>>({});
  const [progress, setProgress] = useState<{ name: string; fraction: number } | null>(null);
  const [uploaded, setUploaded] = useState<UploadedDocument | null>(null);
  const [values, setValues] = useState<FieldValues>({});
  const [problems, setProblems] = useState<Record<string, string>>({});
  const [summary, setSummary] = useState<unknown>(null);
  const [namedTechnicianIds, setNamedTechnicianIds] = useState<number[]>([]);
  const upload = useUploadDocument();
  const submit = useSubmitCredential();

  const type = types.find((t) => t.code === typeCode);
  const heldByTechnician = type?.holder === "technician";
  const holderId = fixedTechnicianId ?? (technicianId ? Number(technicianId) : undefined);
  const definitions = useMemo(() => (type ? fieldDefinitionsFor(type.fieldSet, type.code) : []), [type]);
  const found = useMemo(() => new Set(uploaded?.extraction.found ?? []), [uploaded]);
  const holderName = heldByTechnician ? technicians.find((t) => t.id === holderId)?.name : undefined;

  // A card names its holder: when the reader found no name, the chosen technician's own stands in, to be checked.
  const prefilled = (fields: Record<string, unknown>): FieldValues => {
    const read = toFieldValues(definitions, fields);
    const takesName = definitions.some((d) => d.path === "holderName");
    return takesName && holderName && !read.holderName ? { ...read, holderName } : read;
  };

  const sendFile = (file: File) => {
    const missing: Record<string, string> = {};
    if (!type) missing.typeCode = "Choose the type of document first";
    if (heldByTechnician && !holderId) missing.technicianId = "Choose whose card this is";
    setChoiceProblems(missing);
    if (!type || Object.keys(missing).length > 0) return;
    setProgress({ name: file.name, fraction: 0 });
    upload.mutate(
      {
        file,
        typeCode: type.code,
        technicianId: heldByTechnician ? holderId : undefined,
        onProgress: (fraction) => setProgress({ name: file.name, fraction }),
      },
      {
        onSuccess: (result) => {
          setUploaded(result);
          setValues(prefilled(result.extraction.fields));
          setProblems({});
          setSummary(null);
        },
        onSettled: () => setProgress(null),
      },
    );
  };

  const startOver = () => {
    setUploaded(null);
    setValues({});
    setProblems({});
    setSummary(null);
    setNamedTechnicianIds([]);
    upload.reset();
    submit.reset();
  };

  const send = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    if (!type || !uploaded) return;
    const parsed = parseFieldValues(type.fieldSet, definitions, values);
    if (!parsed.ok) {
      setProblems(parsed.problems);
      setSummary(problemsAsError("Check the fields marked below.", parsed.problems));
      return;
    }
    setProblems({});
    setSummary(null);
    submit.mutate(
      {
        documentId: uploaded.document.id,
        typeCode: type.code,
        ...(heldByTechnician && holderId ? { technicianId: holderId } : {}),
        fields:
          type.fieldSet === "exemption"
            ? { ...parsed.fields, technicianIds: namedTechnicianIds }
            : parsed.fields,
      },
      {
        onSuccess: onSubmitted,
        onError: (error) => {
          const mapped = credentialFieldErrorsOf(error);
          setProblems(mapped);
          setSummary(
            Object.keys(mapped).length > 0
              ? problemsAsError(isApiError(error) ? error.message : "Check the fields marked below.", mapped)
              : error,
          );
        },
      },
    );
  };

  if (!uploaded) {
    return (
      <div className="max-w-2xl space-y-5">
        <CredentialTypeSelect
          types={types}
          value={typeCode}
          onChange={(code) => {
            setTypeCode(code);
            setChoiceProblems({});
          }}
          error={choiceProblems.typeCode}
          disabled={upload.isPending}
        />
        {type && !heldByTechnician && <p className="text-sm text-ink-900">Held by your company.</p>}
        {heldByTechnician && fixedTechnicianId === undefined && (
          <SelectField
            label="Whose card is it?"
            name="technicianId"
            value={technicianId}
            onChange={(event) => setTechnicianId(event.currentTarget.value)}
            options={technicians.map((t) => ({ value: String(t.id), label: t.name }))}
            placeholder="Choose a technician"
            error={choiceProblems.technicianId}
            disabled={upload.isPending}
          />
        )}
        {type && <TypeCaution type={type} />}
        {progress ? (
          <UploadProgress fileName={progress.name} fraction={progress.fraction} />
        ) : (
          <FileDrop
            onFile={sendFile}
            disabled={!type}
            hint={type ? undefined : "Choose the type of document first."}
          />
        )}
        {upload.isError && (
          <p
            role="alert"
            className="rounded-md border-l-4 border-red-700 bg-red-50 px-4 py-3 text-sm font-medium text-red-900"
          >
            {uploadProblem(upload.error)}
          </p>
        )}
      </div>
    );
  }

  const fileBar = (
    <div className="flex flex-wrap items-center justify-between gap-3 rounded-lg border border-ink-100 bg-white px-4 py-3">
      <div className="min-w-0 text-sm">
        <p className="font-semibold text-ink-900">{type?.name}</p>
        <p className="text-ink-900" data-testid="upload-holder">
          {heldByTechnician ? `Held by ${holderName ?? "the technician"}` : "Held by your company"}
        </p>
        <p className="truncate text-ink-700">
          File: {uploaded.document.name} ({formatFileSize(uploaded.document.sizeBytes)})
        </p>
      </div>
      <Button variant="secondary" onClick={startOver} disabled={submit.isPending}>
        Use another file
      </Button>
    </div>
  );

  const preview = (
    <div className="lg:sticky lg:top-4">
      <DocumentViewer
        key={uploaded.document.id}
        documentId={uploaded.document.id}
        name={uploaded.document.name}
        mime={uploaded.document.mime}
        pageLimit={1}
      />
    </div>
  );

  const certificate = uploaded.certificate;
  if (certificate && certificate.coverages.length > 0) {
    return (
      <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        {preview}
        <div className="min-w-0 space-y-5">
          {fileBar}
          <CertificateCoveragesForm
            uploaded={{ ...uploaded, certificate }}
            onSubmitted={(credentials) =>
              onCoveragesSubmitted ? onCoveragesSubmitted(credentials) : onSubmitted(credentials[0]!)
            }
          />
        </div>
      </div>
    );
  }

  return (
    <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
      {preview}
      <form noValidate onSubmit={send} className="min-w-0 space-y-5" aria-label="Check the fields">
        {fileBar}
        <ExtractionNote
          extraction={uploaded.extraction}
          readCount={definitions.filter((d) => found.has(d.path)).length}
        />
        <ReviewerWarnings warnings={uploaded.warnings} title="The reviewer will look at these" />
        <FormError error={summary} labels={labelsOf(definitions)} />
        <CredentialFieldsForm
          definitions={definitions}
          values={values}
          onChange={(path, value) => setValues((current) => ({ ...current, [path]: value }))}
          errors={problems}
          found={found}
          disabled={submit.isPending}
        />
        {type?.fieldSet === "exemption" && fixedTechnicianId === undefined && (
          <NamedTechniciansChecklist
            technicians={technicians}
            checked={namedTechnicianIds}
            onChange={setNamedTechnicianIds}
            error={problems.technicianIds}
            disabled={submit.isPending}
          />
        )}
        <div className="flex flex-wrap gap-3 border-t border-ink-100 pt-4">
          <Button type="submit" pending={submit.isPending} pendingLabel="Sending…" className="min-h-12">
            Send for verification
          </Button>
        </div>
      </form>
    </div>
  );
}
