import { useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { data, useLocation, useNavigate, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { idParam } from "@shared/credentials/schemas.ts";
import { hrefs, paths } from "@/config/paths.ts";
import { CautionNote } from "@/components/ui/caution-note.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import type { CredentialDto as Credential } from "@shared/credentials/credential-shapes.ts";
import { credentialQuery } from "@/features/credentials/api/get-credential.ts";
import { credentialTypesQuery } from "@/features/credentials/api/get-credential-types.ts";
import { getReviewQueue } from "@/features/credentials/api/get-review-queue.ts";
import { AuditTrail } from "@/features/credentials/components/audit-trail.tsx";
import { DocumentViewer } from "@/features/credentials/components/document-viewer.tsx";
import { ReviewPanel } from "@/features/credentials/components/review-panel.tsx";
import { SameDocumentList } from "@/features/credentials/components/same-document-list.tsx";
import { VersionComparison } from "@/features/credentials/components/version-comparison.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { queryClient } from "@/lib/query-client.ts";

const credentialIdOf = (params: { credentialId?: string | undefined }): number => {
  const parsed = idParam.safeParse(params.credentialId);
  if (!parsed.success) throw data("There is no document at this address.", { status: 404 });
  return parsed.data;
};

export async function loader({ params }: LoaderFunctionArgs) {
  await Promise.all([
    queryClient.ensureQueryData(credentialQuery(credentialIdOf(params))),
    queryClient.ensureQueryData(credentialTypesQuery()),
  ]);
  return null;
}

const decidedWords = (c: Credential) =>
  `${c.state === "verified" ? "Verified" : "Returned"}: ${c.typeName} of ${c.technicianName ?? c.companyName}.`;

export function Component() {
  const id = credentialIdOf(useParams());
  const { data: credential } = useSuspenseQuery(credentialQuery(id));
  const { data: types } = useSuspenseQuery(credentialTypesQuery());
  const navigate = useNavigate();
  const arrival = useLocation().state as { decided?: string } | null;
  const [focused, setFocused] = useState<string | null>(null);
  const fieldSet = types.find((t) => t.code === credential.typeCode)?.fieldSet ?? "insurance";

  // After a decision, the next document is the oldest still waiting (the queue's default order).
  const goToNext = async (decided: Credential) => {
    const state = { decided: decidedWords(decided) };
    try {
      const next = (await getReviewQueue({ page: 1, pageSize: 5 })).rows.find((row) => row.id !== decided.id);
      navigate(next ? hrefs.review(next.id) : paths.reviewer.queue, { state });
    } catch {
      navigate(paths.reviewer.queue, { state });
    }
  };

  return (
    <>
      <PageHeader
        title={`${credential.typeName}: ${credential.technicianName ?? credential.companyName}`}
        description={`${credential.companyName} · submitted ${formatDateTime(credential.submittedAt)}`}
      />
      {arrival?.decided && (
        <p
          role="status"
          className="mb-4 rounded-md border-l-4 border-emerald-700 bg-emerald-50 px-4 py-3 text-sm text-ink-900"
        >
          {arrival.decided} This is the next document in the queue.
        </p>
      )}
      <div className="grid items-start gap-6 lg:grid-cols-2">
        <div className="lg:sticky lg:top-4">
          <DocumentViewer
            key={credential.documentId}
            documentId={credential.documentId}
            name={credential.documentName}
            mime={credential.documentMime}
            highlight={focused ? credential.evidence[focused]?.box : undefined}
          />
        </div>
        <div className="space-y-5">
          {credential.category === "insurance" && <CautionNote />}
          <SameDocumentList current={credential.id} rows={credential.sameDocument} />
          <VersionComparison
            previous={credential.previousVersion}
            fieldSet={fieldSet}
            typeCode={credential.typeCode}
          />
          <ReviewPanel
            key={credential.id}
            credential={credential}
            fieldSet={fieldSet}
            onDecided={(c) => void goToNext(c)}
            onFocusField={setFocused}
          />
        </div>
      </div>
      <div className="mt-8">
        <AuditTrail events={credential.audit} />
      </div>
    </>
  );
}
