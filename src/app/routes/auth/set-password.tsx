import { useState } from "react";
import { useSearchParams } from "react-router-dom";
import { paths } from "@/config/paths.ts";
import { SetPasswordForm } from "@/features/accounts/components/set-password-form.tsx";
import { AuthCard } from "./auth-card.tsx";
import { AuthLink } from "./auth-link.tsx";

/** Reached from the e-mailed link (/set-password?token=...), for a reset and for an invitation alike. */
export function Component() {
  const token = useSearchParams()[0].get("token") ?? "";
  const [done, setDone] = useState(false);

  if (done) {
    return (
      <AuthCard title="Your password is set">
        <p role="status" className="text-ink-900">
          You can now sign in with your e-mail address and the new password.
        </p>
        <p className="mt-4">
          <AuthLink to={paths.auth.signIn}>Sign in</AuthLink>
        </p>
      </AuthCard>
    );
  }

  if (!token) {
    return (
      <AuthCard title="This link is incomplete">
        <p className="text-ink-900">
          The address has no token. Open the link from the e-mail again, or ask for a new one.
        </p>
        <p className="mt-4">
          <AuthLink to={paths.auth.forgotPassword}>Ask for a new link</AuthLink>
        </p>
      </AuthCard>
    );
  }

  return (
    <AuthCard
      title="Choose a password"
      intro="You will sign in with your e-mail address and this password."
      footer={
        <p>
          Link expired? <AuthLink to={paths.auth.forgotPassword}>Ask for a new one</AuthLink>
        </p>
      }
    >
      <SetPasswordForm token={token} onDone={() => setDone(true)} />
    </AuthCard>
  );
}
