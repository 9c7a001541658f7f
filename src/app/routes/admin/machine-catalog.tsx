import { useSuspenseQuery } from "@tanstack/react-query";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { useAddCatalogEntry } from "@/features/machines/api/save-catalog-entry.ts";
import { CatalogEntryForm } from "@/features/machines/components/catalog-entry-form.tsx";
import { CatalogList } from "@/features/machines/components/catalog-list.tsx";
import { machineCatalogQuery } from "@/lib/machine-catalog.ts";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(machineCatalogQuery());
  return null;
}

export function Component() {
  const { data: entries } = useSuspenseQuery(machineCatalogQuery());
  const add = useAddCatalogEntry();
  return (
    <>
      <PageHeader
        title="Machine catalog"
        description="The machine builders and control families every machine form, card and directory search picks from. An alias is another spelling that means the same entry; matching ignores case and spacing."
      />
      <div className="grid grid-cols-1 items-start gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="space-y-8">
          <CatalogList kind="builder" title="Machine builders" entries={entries} />
          <CatalogList kind="control_family" title="Control families" entries={entries} />
        </div>
        <section
          aria-labelledby="catalog-add-heading"
          className="rounded-lg border border-ink-100 bg-white p-4 sm:p-5"
        >
          <h2 id="catalog-add-heading" className="mb-3 text-lg font-semibold text-ink-900">
            Add to the catalog
          </h2>
          <CatalogEntryForm
            pending={add.isPending}
            serverError={add.error}
            onSubmit={(input) => add.mutate(input)}
          />
        </section>
      </div>
    </>
  );
}
