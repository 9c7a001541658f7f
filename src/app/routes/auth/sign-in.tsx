import { redirect, useNavigate, useSearchParams } from "react-router-dom";
import type { CurrentUser } from "@shared/accounts/schemas.ts";
import { homePathByRole } from "@/config/navigation.ts";
import { paths, safeRedirectTarget } from "@/config/paths.ts";
import { currentUserQuery } from "@/features/accounts/api/get-current-user.ts";
import { SignInForm } from "@/features/accounts/components/sign-in-form.tsx";
import { queryClient } from "@/lib/query-client.ts";
import { AuthCard } from "./auth-card.tsx";
import { AuthLink } from "./auth-link.tsx";

/** Someone already signed in goes straight to their home; if the server cannot say, show the form. */
export async function loader() {
  const user = await queryClient.ensureQueryData(currentUserQuery()).catch(() => null);
  return user ? redirect(homePathByRole[user.role]) : null;
}

export function Component() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const goOn = (user: CurrentUser) =>
    navigate(safeRedirectTarget(params.get("redirectTo")) ?? homePathByRole[user.role], { replace: true });

  return (
    <AuthCard
      title="Sign in"
      intro="Credentials, standing and work orders for CNC field service."
      footer={
        <>
          <p>
            <AuthLink to={paths.auth.forgotPassword}>Forgot your password?</AuthLink>
          </p>
          <p>
            New to Clearbench? <AuthLink to={paths.auth.signUp}>Create a company account</AuthLink>
          </p>
        </>
      }
    >
      <SignInForm onSignedIn={goOn} />
    </AuthCard>
  );
}
