import { roleLabels } from "@/config/navigation.ts";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import type { AdminUser } from "../api/get-users.ts";

const column = dataTableColumns<AdminUser>();
const columns = column.columns([
  column.accessor("name", { header: "Name", sortFn: "text" }),
  column.accessor("email", { header: "E-mail", sortFn: "text" }),
  column.accessor((user) => roleLabels[user.role], { id: "role", header: "Role", sortFn: "text" }),
  column.accessor("companyName", { header: "Company", sortFn: "text" }),
]);

export function UsersTable({ users }: { users: AdminUser[] }) {
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
