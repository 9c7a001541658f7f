import { useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { machineStateLabels } from "@shared/machines/machine-states.ts";
import { hrefs, paths } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { Button } from "@/components/ui/button.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { StatusKey } from "@/components/ui/status-key.tsx";
import { machineQuery } from "@/features/machines/api/get-machine.ts";
import { machineHistoryQuery } from "@/features/machines/api/get-machine-history.ts";
import { useRecordShopService } from "@/features/machines/api/record-shop-service.ts";
import { useSaveMachine } from "@/features/machines/api/save-machine.ts";
import { MachineRecord } from "@/features/machines/components/machine-record.tsx";
import { MachineRecordForm } from "@/features/machines/components/machine-record-form.tsx";
import { ServiceHistory } from "@/features/machines/components/service-history.tsx";
import { ShopRecordForm } from "@/features/machines/components/shop-record-form.tsx";
import { MachinePhotos } from "@/features/machines/components/machine-photos.tsx";
import { MachineDowntime } from "@/features/machines/components/machine-downtime.tsx";
import { queryClient } from "@/lib/query-client.ts";
import { machineIdOf } from "./machine-id.ts";

export async function loader({ params }: LoaderFunctionArgs) {
  const id = machineIdOf(params);
  await Promise.all([
    queryClient.ensureQueryData(machineQuery(id)),
    queryClient.ensureQueryData(machineHistoryQuery(id)),
  ]);
  return null;
}

export function Component() {
  const id = machineIdOf(useParams());
  const { data: machine } = useSuspenseQuery(machineQuery(id));
  const { data: history } = useSuspenseQuery(machineHistoryQuery(id));
  const save = useSaveMachine(machine.siteId, machine.id);
  const record = useRecordShopService(machine.id);
  const [editing, setEditing] = useState(false);
  const [recording, setRecording] = useState(false);
  return (
    <>
      <Link
        to={paths.buyer.machines}
        className="mb-2 inline-flex min-h-11 items-center text-sm text-ink-700 underline underline-offset-2"
      >
        All machines
      </Link>
      <PageHeader
        title={`${machine.builder} ${machine.model}`}
        description={
          <span className="break-words">
            {machine.serialNumber ? `Serial ${machine.serialNumber} · ` : ""}
            {machine.siteName} · {machineStateLabels[machine.state ?? "running"]}
          </span>
        }
        actions={
          !editing && (
            <Button variant="secondary" onClick={() => setEditing(true)}>
              Edit machine
            </Button>
          )
        }
      />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <div className="min-w-0 space-y-6">
          {editing ? (
            <MachineRecordForm
              machine={machine}
              pending={save.isPending}
              serverError={save.error}
              onCancel={() => setEditing(false)}
              onSubmit={(input) => save.mutate(input, { onSuccess: () => setEditing(false) })}
            />
          ) : (
            <MachineRecord machine={machine} />
          )}
          <nav aria-label="More for this machine" className="flex flex-wrap gap-2">
            <Link to={hrefs.machineMaintenance(machine.id)} className={buttonStyles("secondary")}>
              Maintenance plans
            </Link>
            <Link to={hrefs.machineTransfer(machine.id)} className={buttonStyles("secondary")}>
              Sell or transfer
            </Link>
          </nav>
          <MachineDowntime machineId={machine.id} state={machine.state ?? "running"} />
          <MachinePhotos machineId={machine.id} />
        </div>
        <div className="min-w-0 space-y-4">
          <ServiceHistory history={history} />
          {recording ? (
            <ShopRecordForm
              pending={record.isPending}
              serverError={record.error}
              onCancel={() => setRecording(false)}
              onSubmit={(input) => record.mutate(input, { onSuccess: () => setRecording(false) })}
            />
          ) : (
            <Button variant="secondary" onClick={() => setRecording(true)}>
              Record outside work
            </Button>
          )}
          <StatusKey statuses={["cleared", "lapsing", "not_cleared"]} />
        </div>
      </div>
    </>
  );
}
