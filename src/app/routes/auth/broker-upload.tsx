import { useState, type FormEvent } from "react";
import { useParams } from "react-router-dom";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { isApiError } from "@/lib/api-client.ts";
import { useBrokerUpload, useSendBrokerCertificate } from "@/features/credentials/api/broker-upload.ts";
import { AuthCard } from "./auth-card.tsx";
import { MAX_UPLOAD_SIZE_WORDS } from "@shared/credentials/upload-limits.ts";

const formatDay = (iso: string) =>
  new Intl.DateTimeFormat("en-US", { dateStyle: "long" }).format(new Date(iso));

/** The broker's page: no account, one PDF, once. */
export function Component() {
  const token = useParams().token ?? "";
  const page = useBrokerUpload(token);
  const send = useSendBrokerCertificate();
  const [file, setFile] = useState<File | null>(null);
  const [progress, setProgress] = useState(0);

  if (page.isPending) return <AuthCard title="Opening the upload link">Checking the link…</AuthCard>;
  if (page.isError) {
    const gone = isApiError(page.error) && page.error.status === 410;
    return (
      <AuthCard title={gone ? "This link no longer works" : "This link was not found"}>
        <p className="text-ink-900">
          {gone
            ? page.error.message
            : "Check that the whole address from the e-mail was opened, or ask the company for a new link."}
        </p>
      </AuthCard>
    );
  }
  if (send.isSuccess) {
    return (
      <AuthCard title="Certificate received">
        <p role="status" className="text-ink-900">
          {send.data.document.name} is with {page.data.companyName}. A compliance reviewer checks it before it
          counts; this link is now used up.
        </p>
      </AuthCard>
    );
  }

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    if (file) send.mutate({ token, file, onProgress: setProgress });
  };
  return (
    <AuthCard
      title="Upload a certificate of insurance"
      intro={`${page.data.companyName} asks for a current certificate for its ${page.data.coverageName}.`}
    >
      {page.data.certificateHolder && (
        <p className="mb-3 text-ink-900">
          Name <strong>{page.data.certificateHolder}</strong> as certificate holder.
        </p>
      )}
      <p className="mb-4 text-sm text-ink-700">
        One PDF, up to {MAX_UPLOAD_SIZE_WORDS}. The link works once, until {formatDay(page.data.expiresAt)}.
      </p>
      <form onSubmit={onSubmit} noValidate className="space-y-4">
        <FormError error={send.error} labels={{ file: "Certificate (PDF)" }} />
        <div>
          <label htmlFor="file" className="block font-medium text-ink-900">
            Certificate (PDF)
          </label>
          <input
            id="file"
            name="file"
            type="file"
            accept="application/pdf,.pdf"
            aria-describedby="broker-certificate-hint"
            className="mt-1 block w-full text-sm"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
          />
          <p id="broker-certificate-hint" className="mt-1 text-sm text-ink-700">
            Exported or scanned to PDF; a photo or a Word file is refused.
          </p>
        </div>
        <Button
          type="submit"
          disabled={!file}
          pending={send.isPending}
          pendingLabel={`Uploading ${Math.round(progress * 100)}%`}
        >
          Send the certificate
        </Button>
      </form>
    </AuthCard>
  );
}
