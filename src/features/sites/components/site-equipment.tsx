import { useState } from "react";
import { Link } from "react-router-dom";
import { technologyLabels } from "@shared/technicians/schemas.ts";
import { hrefs } from "@/config/paths.ts";
import { Button } from "@/components/ui/button.tsx";
import { Spinner } from "@/components/ui/spinner.tsx";
import { useSiteEquipment } from "../api/get-site-equipment.ts";
import { useRemoveEquipment } from "../api/remove-equipment.ts";
import { useSaveEquipment } from "../api/save-equipment.ts";
import { EquipmentForm } from "./equipment-form.tsx";

type SiteEquipmentProps = {
  siteId: number;
  siteName: string;
  /** The page refreshes what other screens hold of the machines (the machines list) after each change. */
  onMachinesChanged?: () => void;
};

/** The machines of one site, each editable, and a form to add another. */
export function SiteEquipment({ siteId, siteName, onMachinesChanged }: SiteEquipmentProps) {
  const equipment = useSiteEquipment(siteId);
  const save = useSaveEquipment();
  const remove = useRemoveEquipment();
  const [editing, setEditing] = useState<number | null>(null);

  if (equipment.isPending) return <Spinner label="Loading machines" />;
  const machines = equipment.data ?? [];
  return (
    <section aria-label={`Machines at ${siteName}`} className="space-y-3">
      <h3 className="font-semibold text-ink-900">Machines</h3>
      {machines.length === 0 ? (
        <p className="text-sm text-ink-700">
          No machines yet. Add one so the directory can match technicians to it.
        </p>
      ) : (
        <ul className="divide-y divide-ink-100 rounded-md border border-ink-100">
          {machines.map((m) => (
            <li key={m.id} className="px-3 py-2">
              {editing === m.id ? (
                <EquipmentForm
                  equipment={m}
                  pending={save.isPending}
                  serverError={save.error}
                  onSubmit={(input) =>
                    save.mutate(
                      { siteId, equipmentId: m.id, input },
                      {
                        onSuccess: () => {
                          setEditing(null);
                          onMachinesChanged?.();
                        },
                      },
                    )
                  }
                  onCancel={() => setEditing(null)}
                />
              ) : (
                <div className="flex flex-wrap items-center justify-between gap-2">
                  <span className="text-sm text-ink-900">
                    <Link to={hrefs.machine(m.id)} className="font-medium underline underline-offset-2">
                      {m.builder} {m.model}
                    </Link>{" "}
                    · {technologyLabels[m.technology]} · {m.controlFamily}
                    {m.serialNumber && <span className="text-ink-700"> · serial {m.serialNumber}</span>}
                  </span>
                  <span className="flex gap-2">
                    <Button
                      variant="quiet"
                      onClick={() => setEditing(m.id)}
                      aria-label={`Edit ${m.builder} ${m.model}`}
                    >
                      Edit
                    </Button>
                    <Button
                      variant="danger"
                      pending={remove.isPending && remove.variables?.equipmentId === m.id}
                      onClick={() =>
                        remove.mutate({ siteId, equipmentId: m.id }, { onSuccess: onMachinesChanged })
                      }
                      aria-label={`Remove ${m.builder} ${m.model}`}
                    >
                      Remove
                    </Button>
                  </span>
                </div>
              )}
            </li>
          ))}
        </ul>
      )}
      {editing === null && (
        <EquipmentForm
          pending={save.isPending}
          serverError={save.error}
          onSubmit={(input) => save.mutate({ siteId, input }, { onSuccess: onMachinesChanged })}
        />
      )}
    </section>
  );
}
