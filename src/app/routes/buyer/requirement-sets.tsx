import { useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { Button } from "@/components/ui/button.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { credentialTypesQuery } from "@/features/credentials/api/get-credential-types.ts";
import { useArchiveRequirementSet } from "@/features/standing/api/archive-requirement-set.ts";
import { requirementSetsQuery } from "@/features/standing/api/get-requirement-sets.ts";
import { useSaveRequirementSet } from "@/features/standing/api/save-requirement-set.ts";
import { RequirementSetEditor } from "@/features/standing/components/requirement-set-editor.tsx";
import { RequirementSetSummary } from "@/features/standing/components/requirement-set-summary.tsx";
import { sitesQuery } from "@/features/sites/api/get-sites.ts";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await Promise.all([
    queryClient.ensureQueryData(requirementSetsQuery()),
    queryClient.ensureQueryData(sitesQuery()),
    queryClient.ensureQueryData(credentialTypesQuery()),
  ]);
  return null;
}

export function Component() {
  const { data: sets } = useSuspenseQuery(requirementSetsQuery());
  const { data: sites } = useSuspenseQuery(sitesQuery());
  const { data: types } = useSuspenseQuery(credentialTypesQuery());
  const [editing, setEditing] = useState<number | "new" | null>(null);
  const save = useSaveRequirementSet();
  const archive = useArchiveRequirementSet();
  const activeTypes = types.filter((t) => t.active).map((t) => ({ code: t.code, name: t.name }));
  const typeNames = new Map(types.map((t) => [t.code, t.name]));
  const siteOptions = sites.map((s) => ({ value: String(s.id), label: s.name }));
  const siteName = (id: number | null) => sites.find((s) => s.id === id)?.name ?? null;
  const editorFor = (setId?: number) => (
    <RequirementSetEditor
      set={sets.find((s) => s.id === setId)}
      siteOptions={siteOptions}
      credentialTypes={activeTypes}
      pending={save.isPending}
      serverError={save.error}
      onSubmit={(input) =>
        save.mutate({ requirementSetId: setId, input }, { onSuccess: () => setEditing(null) })
      }
      onCancel={() => {
        save.reset();
        setEditing(null);
      }}
    />
  );
  const add = (
    <Button onClick={() => setEditing("new")} disabled={editing !== null}>
      New requirement set
    </Button>
  );
  return (
    <>
      <PageHeader
        title="Requirement sets"
        description="What a technician must hold to work at your sites: insurance limits, safety training and machine builder training."
        actions={add}
      />
      {editing === "new" && <section className="mb-6">{editorFor()}</section>}
      {sets.length === 0 && editing !== "new" ? (
        <EmptyState title="No requirement sets yet" action={add}>
          Every listed technician already meets the platform baseline. Add a set for what your sites ask on
          top.
        </EmptyState>
      ) : (
        <ul className="space-y-4">
          {sets.map((set) => (
            <li key={set.id} className="rounded-lg border border-ink-100 bg-white p-4">
              {editing === set.id ? (
                editorFor(set.id)
              ) : (
                <div className="flex flex-wrap items-start justify-between gap-3">
                  <RequirementSetSummary set={set} siteName={siteName(set.siteId)} typeNames={typeNames} />
                  <div className="flex gap-2">
                    <Button
                      variant="secondary"
                      onClick={() => setEditing(set.id)}
                      disabled={editing !== null}
                      aria-label={`Edit ${set.name}`}
                    >
                      Edit
                    </Button>
                    <Button
                      variant="danger"
                      pending={archive.isPending && archive.variables === set.id}
                      onClick={() => archive.mutate(set.id)}
                      aria-label={`Archive ${set.name}`}
                    >
                      Archive
                    </Button>
                  </div>
                </div>
              )}
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
