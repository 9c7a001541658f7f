import { useCallback, useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { credentialTypesQuery } from "@/features/credentials/api/get-credential-types.ts";
import { CatalogueTable } from "@/features/credentials/components/catalogue-table.tsx";
import { CredentialTypeForm } from "@/features/credentials/components/credential-type-form.tsx";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(credentialTypesQuery());
  return null;
}

export function Component() {
  const { data: types } = useSuspenseQuery(credentialTypesQuery());
  const [editing, setEditing] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const edit = useCallback((code: string) => {
    setEditing(code);
    setSaved(null);
  }, []);
  const type = types.find((t) => t.code === editing);

  return (
    <>
      <PageHeader
        title="Credential catalog"
        description="The credential types companies and technicians can hold: who holds each, how long it counts, and whether uploaders can choose it."
      />
      {saved && (
        <p
          role="status"
          className="mb-4 rounded-md border-l-4 border-emerald-700 bg-emerald-50 px-4 py-3 text-sm text-ink-900"
        >
          Saved {saved}.
        </p>
      )}
      <div className="grid items-start gap-8 lg:grid-cols-[minmax(0,1fr)_24rem]">
        <CatalogueTable types={types} editingCode={editing} onEdit={edit} />
        {type ? (
          <section className="rounded-lg border border-ink-100 bg-white p-4 sm:p-5">
            <CredentialTypeForm
              key={type.code}
              type={type}
              onDone={() => {
                setSaved(type.name);
                setEditing(null);
              }}
            />
          </section>
        ) : (
          <p className="text-sm text-ink-700">
            Choose Edit on a row to change its name, description, months or whether it is in use.
          </p>
        )}
      </div>
    </>
  );
}
