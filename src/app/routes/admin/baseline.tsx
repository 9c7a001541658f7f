import { useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { Button } from "@/components/ui/button.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { baselineQuery } from "@/features/standing/api/get-baseline.ts";
import { BaselineEditor } from "@/features/standing/components/baseline-editor.tsx";
import { BaselineSummary } from "@/features/standing/components/baseline-summary.tsx";
import { credentialTypesQuery } from "@/features/credentials/api/get-credential-types.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await Promise.all([
    queryClient.ensureQueryData(baselineQuery()),
    queryClient.ensureQueryData(credentialTypesQuery()),
  ]);
  return null;
}

export function Component() {
  const { data: baseline } = useSuspenseQuery(baselineQuery());
  const { data: types } = useSuspenseQuery(credentialTypesQuery());
  const [editing, setEditing] = useState(false);
  const [saved, setSaved] = useState(false);
  const typeNames = new Map(types.map((t) => [t.code, t.name]));
  // A type taken out of use stays offered while the baseline still names it, so saving does not drop it silently.
  const inBaseline = new Set(baseline.requirements.flatMap((r) => r.typeCodes));
  const choices = types
    .filter((t) => t.active || inBaseline.has(t.code))
    .map((t) => ({ code: t.code, name: t.active ? t.name : `${t.name} (not in use)` }));

  return (
    <>
      <PageHeader
        title="Platform baseline"
        description="What every technician must meet to appear to buyers at all, whatever a shop asks on top."
        actions={
          !editing && (
            <Button
              onClick={() => {
                setEditing(true);
                setSaved(false);
              }}
            >
              Edit baseline
            </Button>
          )
        }
      />
      <p className="mb-4 rounded-md border-l-4 border-accent-500 bg-amber-50 px-4 py-3 text-sm text-ink-900">
        <span className="font-semibold">Saving recomputes every technician&apos;s standing.</span> Anyone who
        no longer meets the baseline drops out of the directory at once, and buyers&apos; requirement sets
        apply on top of it.
      </p>
      {saved && (
        <p
          role="status"
          className="mb-4 rounded-md border-l-4 border-emerald-700 bg-emerald-50 px-4 py-3 text-sm text-ink-900"
        >
          Baseline saved; every technician&apos;s standing was recomputed.
        </p>
      )}
      <p className="mb-3 text-sm text-ink-700">
        Last changed <time dateTime={baseline.updatedAt}>{formatDateTime(baseline.updatedAt)}</time>.
      </p>
      {editing ? (
        <BaselineEditor
          baseline={baseline}
          credentialTypes={choices}
          onSaved={() => {
            setEditing(false);
            setSaved(true);
          }}
          onCancel={() => setEditing(false)}
        />
      ) : (
        <BaselineSummary requirements={baseline.requirements} typeNames={typeNames} />
      )}
    </>
  );
}
