import { useSuspenseQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { paths } from "@/config/paths.ts";
import { companiesQuery } from "@/features/admin/api/get-companies.ts";
import { usersQuery } from "@/features/admin/api/get-users.ts";
import { InviteUserForm } from "@/features/admin/components/invite-user-form.tsx";
import { UsersTable } from "@/features/admin/components/users-table.tsx";
import { queryClient } from "@/lib/query-client.ts";
import { useCurrentUser } from "@/features/accounts/api/get-current-user.ts";

export async function loader() {
  await Promise.all([
    queryClient.ensureQueryData(usersQuery()),
    queryClient.ensureQueryData(companiesQuery()),
  ]);
  return null;
}

export function Component() {
  const { data: users } = useSuspenseQuery(usersQuery());
  const { data: companies } = useSuspenseQuery(companiesQuery());
  const { data: me } = useCurrentUser();

  return (
    <>
      <PageHeader
        title="Users"
        description="Everyone who can sign in, by company, and whether they are invited, active or deactivated. Invite people; they choose their own password. Deactivating someone signs them out everywhere at once."
        actions={
          <Link to={paths.admin.companies} className={buttonStyles("secondary")}>
            Companies ({companies.length})
          </Link>
        }
      />
      <div className="grid grid-cols-1 items-start gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <section aria-labelledby="users-heading">
          <h2 id="users-heading" className="mb-3 text-lg font-semibold text-ink-900">
            All users <span className="text-base font-normal text-ink-700">({users.length})</span>
          </h2>
          <UsersTable users={users} selfId={me?.id ?? 0} />
        </section>
        <section className="rounded-lg border border-ink-100 bg-white p-4 sm:p-5">
          <InviteUserForm companies={companies} />
        </section>
      </div>
    </>
  );
}
