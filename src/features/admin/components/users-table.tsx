import { useMemo } from "react";
import { roleLabels } from "@/config/navigation.ts";
import { Button } from "@/components/ui/button.tsx";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import type { UserStatus } from "@shared/accounts/schemas.ts";
import type { AdminUser } from "../api/get-users.ts";
import { useSetUserActive } from "../api/set-user-active.ts";

const STATUS_WORDS: Record<UserStatus, { mark: string; word: string }> = {
  invited: { mark: "○", word: "Invited" },
  active: { mark: "●", word: "Active" },
  deactivated: { mark: "✕", word: "Deactivated" },
};

function StatusCell({ status }: { status: UserStatus }) {
  const { mark, word } = STATUS_WORDS[status];
  return (
    <span className={status === "deactivated" ? "text-red-800" : "text-ink-900"}>
      <span aria-hidden="true">{mark} </span>
      {word}
    </span>
  );
}

/** Deactivating ends the user's sessions at once, so the button says so rather than asking twice. */
function UserAction({ user, selfId }: { user: AdminUser; selfId: number }) {
  const change = useSetUserActive();
  if (user.id === selfId) return <span className="text-sm text-ink-700">You</span>;
  const active = user.status === "deactivated";
  return (
    <div className="space-y-1">
      <Button
        variant="secondary"
        className="whitespace-nowrap"
        pending={change.isPending}
        pendingLabel="Saving"
        aria-label={`${active ? "Reactivate" : "Deactivate"} ${user.name}`}
        title={active ? undefined : "Signs them out everywhere at once"}
        onClick={() => change.mutate({ userId: user.id, active })}
      >
        {active ? "Reactivate" : "Deactivate"}
      </Button>
      <FormError error={change.error} />
    </div>
  );
}

const column = dataTableColumns<AdminUser>();

export function UsersTable({ users, selfId }: { users: AdminUser[]; selfId: number }) {
  const columns = useMemo(() => userColumns(selfId), [selfId]);
  return (
    <DataTable
      caption="Users"
      hideCaption
      columns={columns}
      data={users}
      getRowId={(user) => String(user.id)}
      initialSorting={[{ id: "companyName", desc: false }]}
      empty={<EmptyState title="No users yet">Invite the first one with the form.</EmptyState>}
    />
  );
}

function userColumns(selfId: number) {
  return column.columns([
    column.accessor("name", { header: "Name", sortFn: "text" }),
    column.accessor("email", {
      header: "E-mail",
      sortFn: "text",
      cell: (info) => <span className="break-all">{info.getValue()}</span>,
    }),
    column.accessor((user) => roleLabels[user.role], { id: "role", header: "Role", sortFn: "text" }),
    column.accessor("companyName", { header: "Company", sortFn: "text" }),
    column.accessor("status", {
      header: "Status",
      sortFn: "text",
      cell: (info) => <StatusCell status={info.getValue()} />,
    }),
    column.display({
      id: "action",
      header: "Action",
      cell: (info) => <UserAction user={info.row.original} selfId={selfId} />,
    }),
  ]);
}
