import { useCallback, useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { Button } from "@/components/ui/button.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { outboxQuery } from "@/features/admin/api/get-outbox.ts";
import { CaughtMailView } from "@/features/admin/components/caught-mail-view.tsx";
import { OutboxTable } from "@/features/admin/components/outbox-table.tsx";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(outboxQuery());
  return null;
}

export function Component() {
  const { data: mail, refetch, isFetching } = useSuspenseQuery(outboxQuery());
  const [openId, setOpenId] = useState<number | null>(null);
  const toggle = useCallback((id: number) => setOpenId((current) => (current === id ? null : id)), []);
  const open = mail.find((m) => m.id === openId);

  return (
    <>
      <PageHeader
        title="Outbox"
        description="Mail the app sent, as caught by the development mail catcher. Nothing here left the machine."
        actions={
          <Button
            variant="secondary"
            pending={isFetching}
            pendingLabel="Refreshing…"
            onClick={() => void refetch()}
          >
            Refresh
          </Button>
        }
      />
      <div className="grid items-start gap-6 lg:grid-cols-2">
        <OutboxTable mail={mail} openId={openId} onOpen={toggle} />
        {open ? (
          <CaughtMailView mail={open} />
        ) : (
          mail.length > 0 && <p className="text-sm text-ink-700">Choose a subject to read the mail.</p>
        )}
      </div>
    </>
  );
}
