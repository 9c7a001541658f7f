import { useNavigate } from "react-router-dom";
import { roleLabels } from "@/config/navigation.ts";
import { paths } from "@/config/paths.ts";
import { Button } from "@/components/ui/button.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { Spinner } from "@/components/ui/spinner.tsx";
import { useCurrentUser } from "@/features/accounts/api/get-current-user.ts";
import { useSignOut } from "@/features/accounts/api/sign-out.ts";

const companyKindWords = {
  service: "Field-service company",
  shop: "Machine shop",
  platform: "Platform",
} as const;

export function Component() {
  const { data: user } = useCurrentUser();
  const signOut = useSignOut();
  const navigate = useNavigate();
  if (!user) return <Spinner />;

  const rows: Array<[string, string]> = [
    ["Name", user.name],
    ["E-mail", user.email],
    ["Role", roleLabels[user.role]],
    ["Company", user.companyName],
    ["Company type", companyKindWords[user.companyKind]],
  ];

  return (
    <>
      <PageHeader title="Account" description="Who you are signed in as." />
      <section
        aria-labelledby="account-details"
        className="max-w-2xl rounded-lg border border-ink-100 bg-white"
      >
        <h2 id="account-details" className="sr-only">
          Your details
        </h2>
        <dl className="divide-y divide-ink-100">
          {rows.map(([term, value]) => (
            <div key={term} className="grid gap-1 px-4 py-3 sm:grid-cols-[10rem_1fr]">
              <dt className="text-sm text-ink-700">{term}</dt>
              <dd className="break-words text-ink-900">{value}</dd>
            </div>
          ))}
        </dl>
      </section>
      <div className="mt-6">
        <Button
          variant="secondary"
          pending={signOut.isPending}
          pendingLabel="Signing out…"
          onClick={() =>
            signOut.mutate(undefined, { onSuccess: () => navigate(paths.auth.signIn, { replace: true }) })
          }
        >
          Sign out
        </Button>
      </div>
    </>
  );
}
