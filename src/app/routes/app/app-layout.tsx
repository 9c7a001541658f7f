import { Navigate, Outlet, useLocation, useNavigate } from "react-router-dom";
import { AppHeader } from "@/components/layouts/app-header.tsx";
import { homePathByRole, navigationByRole } from "@/config/navigation.ts";
import { paths, signInHref } from "@/config/paths.ts";
import { useCurrentUser } from "@/features/accounts/api/get-current-user.ts";
import { useSignOut } from "@/features/accounts/api/sign-out.ts";
import { NotificationsBell } from "@/features/notices/components/notifications-bell.tsx";
import { RouteError } from "../../route-error.tsx";
import { useSessionExpiry } from "../../use-session-expiry.ts";

/** The signed-in frame: header with the role's navigation and the user menu, then the page. */
export function Component() {
  const { data: user } = useCurrentUser();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();
  useSessionExpiry();

  if (!user) {
    // After signing out, start fresh; after a lapsed session, come back to this page.
    const leaving = signOut.isPending || signOut.isSuccess;
    return (
      <Navigate to={leaving ? paths.auth.signIn : signInHref(location.pathname + location.search)} replace />
    );
  }

  return (
    <div className="flex min-h-dvh flex-col bg-paper">
      <a
        href="#main"
        className="sr-only z-30 rounded-md bg-white px-3 py-2 text-ink-900 focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:outline-2 focus:outline-ink-700"
      >
        Skip to content
      </a>
      <AppHeader
        items={navigationByRole[user.role]}
        user={user}
        homeHref={homePathByRole[user.role]}
        signingOut={signOut.isPending}
        tools={<NotificationsBell />}
        onSignOut={() =>
          signOut.mutate(undefined, { onSuccess: () => navigate(paths.auth.signIn, { replace: true }) })
        }
      />
      <main
        id="main"
        tabIndex={-1}
        className="mx-auto w-full max-w-7xl flex-1 px-4 py-6 focus:outline-none sm:px-6 sm:py-8"
      >
        <Outlet />
      </main>
    </div>
  );
}

export function ErrorBoundary() {
  return <RouteError />;
}
