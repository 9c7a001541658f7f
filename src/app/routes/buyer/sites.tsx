import { useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { Button } from "@/components/ui/button.tsx";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { hrefs, paths } from "@/config/paths.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { usTimeZoneOptions } from "@/features/accounts/components/us-time-zones.ts";
import { machineKeys } from "@/features/machines/api/machine-keys.ts";
import { useArchiveSite } from "@/features/sites/api/archive-site.ts";
import { sitesQuery } from "@/features/sites/api/get-sites.ts";
import { useSaveSite } from "@/features/sites/api/save-site.ts";
import type { SiteDto as Site } from "@shared/sites/schemas.ts";
import { SiteEquipment } from "@/features/sites/components/site-equipment.tsx";
import { SiteForm } from "@/features/sites/components/site-form.tsx";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(sitesQuery());
  return null;
}

function SiteCard({ site }: { site: Site }) {
  const [editing, setEditing] = useState(false);
  const save = useSaveSite();
  const archive = useArchiveSite();
  return (
    <li className="space-y-4 rounded-lg border border-ink-100 bg-white p-4">
      {editing ? (
        <SiteForm
          site={site}
          timeZoneOptions={usTimeZoneOptions}
          pending={save.isPending}
          serverError={save.error}
          onSubmit={(input) =>
            save.mutate({ siteId: site.id, input }, { onSuccess: () => setEditing(false) })
          }
          onCancel={() => setEditing(false)}
        />
      ) : (
        <div className="flex flex-wrap items-start justify-between gap-3">
          <div>
            <h2 className="text-lg font-semibold text-ink-900">{site.name}</h2>
            <p className="text-sm text-ink-700">
              {site.addressLine}, {site.city ? `${site.city}, ${site.state ?? ""} ` : ""}
              {site.postalCode} · {site.timeZone}
            </p>
          </div>
          <div className="flex gap-2">
            <Link
              to={hrefs.gateSign(site.id)}
              className={buttonStyles("secondary")}
              aria-label={`Print the gate sign for ${site.name}`}
            >
              Gate sign
            </Link>
            <Button variant="secondary" onClick={() => setEditing(true)} aria-label={`Edit ${site.name}`}>
              Edit
            </Button>
            <Button
              variant="danger"
              pending={archive.isPending}
              onClick={() => archive.mutate(site.id)}
              aria-label={`Archive ${site.name}`}
            >
              Archive
            </Button>
          </div>
        </div>
      )}
      <SiteEquipment
        siteId={site.id}
        siteName={site.name}
        // The machines screen lists the same rows: without this it showed an added machine only once its cache aged.
        onMachinesChanged={() => void queryClient.invalidateQueries({ queryKey: machineKeys.all })}
      />
    </li>
  );
}

export function Component() {
  const { data: sites } = useSuspenseQuery(sitesQuery());
  const [adding, setAdding] = useState(false);
  const save = useSaveSite();
  const add = (
    <Button onClick={() => setAdding(true)} disabled={adding}>
      Add a site
    </Button>
  );
  return (
    <>
      <PageHeader
        title="Sites"
        description="Your shop's sites and the machines at each; picking a machine fills the directory's filters."
        actions={
          <>
            {add}
            <Link to={paths.buyer.machinesImport} className={buttonStyles("secondary")}>
              Import machines from CSV
            </Link>
          </>
        }
      />
      {adding && (
        <section aria-label="New site" className="mb-6 rounded-lg border border-ink-100 bg-white p-4">
          <SiteForm
            timeZoneOptions={usTimeZoneOptions}
            pending={save.isPending}
            serverError={save.error}
            onSubmit={(input) => save.mutate({ input }, { onSuccess: () => setAdding(false) })}
            onCancel={() => setAdding(false)}
          />
        </section>
      )}
      {sites.length === 0 && !adding ? (
        <EmptyState title="No sites yet" action={add}>
          Add the sites where technicians will work; the directory measures distances from them.
        </EmptyState>
      ) : (
        <ul className="space-y-4">
          {sites.map((site) => (
            <SiteCard key={site.id} site={site} />
          ))}
        </ul>
      )}
    </>
  );
}
