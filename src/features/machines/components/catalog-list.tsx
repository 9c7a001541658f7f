import { useState } from "react";
import type { CatalogKind } from "@shared/machines/catalog.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import type { CatalogEntry } from "@/lib/machine-catalog.ts";
import { useEditCatalogEntry } from "../api/save-catalog-entry.ts";
import { CatalogEntryForm } from "./catalog-entry-form.tsx";

function CatalogRow({ entry }: { entry: CatalogEntry }) {
  const [editing, setEditing] = useState(false);
  const edit = useEditCatalogEntry();
  const toggle = () =>
    edit.mutate({
      id: entry.id,
      input: { kind: entry.kind, name: entry.name, aliases: entry.aliases, active: !entry.active },
    });
  return (
    <li className="space-y-2 border-b border-ink-100 px-4 py-3 last:border-b-0">
      {editing ? (
        <CatalogEntryForm
          entry={entry}
          pending={edit.isPending}
          serverError={edit.error}
          onSubmit={(input) => edit.mutate({ id: entry.id, input }, { onSuccess: () => setEditing(false) })}
          onCancel={() => setEditing(false)}
        />
      ) : (
        <div className="flex flex-wrap items-start justify-between gap-2">
          <div className="min-w-0">
            <p className="font-medium text-ink-900">
              {entry.name}
              {!entry.active && (
                <span className="ml-2 text-sm font-normal text-ink-700">
                  <span aria-hidden="true">✕ </span>Retired
                </span>
              )}
            </p>
            <p className="text-sm break-words text-ink-700">
              {entry.aliases.length > 0 ? `Also: ${entry.aliases.join(", ")}` : "No aliases"}
            </p>
          </div>
          <div className="flex flex-wrap gap-2">
            <Button variant="quiet" onClick={() => setEditing(true)} aria-label={`Edit ${entry.name}`}>
              Edit
            </Button>
            <Button
              variant="secondary"
              pending={edit.isPending}
              pendingLabel="Saving"
              onClick={toggle}
              aria-label={`${entry.active ? "Retire" : "Restore"} ${entry.name}`}
            >
              {entry.active ? "Retire" : "Restore"}
            </Button>
          </div>
        </div>
      )}
      {!editing && <FormError error={edit.error} />}
    </li>
  );
}

/** One kind's entries, retired ones last; retiring hides an entry from the pickers but keeps records that name it. */
export function CatalogList({
  kind,
  title,
  entries,
}: {
  kind: CatalogKind;
  title: string;
  entries: CatalogEntry[];
}) {
  const mine = entries
    .filter((e) => e.kind === kind)
    .sort((a, b) => Number(b.active) - Number(a.active) || a.name.localeCompare(b.name));
  const headingId = `catalog-${kind}`;
  return (
    <section aria-labelledby={headingId}>
      <h2 id={headingId} className="mb-2 text-lg font-semibold text-ink-900">
        {title} <span className="text-base font-normal text-ink-700">({mine.length})</span>
      </h2>
      {mine.length === 0 ? (
        <p className="text-sm text-ink-700">None yet.</p>
      ) : (
        <ul className="rounded-lg border border-ink-100 bg-white">
          {mine.map((entry) => (
            <CatalogRow key={entry.id} entry={entry} />
          ))}
        </ul>
      )}
    </section>
  );
}
