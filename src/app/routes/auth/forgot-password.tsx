import { paths } from "@/config/paths.ts";
import { ForgotPasswordForm } from "@/features/accounts/components/forgot-password-form.tsx";
import { AuthCard } from "./auth-card.tsx";
import { AuthLink } from "./auth-link.tsx";

export function Component() {
  return (
    <AuthCard
      title="Reset your password"
      intro="Enter the e-mail address you sign in with. We will send a link to choose a new password."
      footer={
        <p>
          <AuthLink to={paths.auth.signIn}>Back to sign in</AuthLink>
        </p>
      }
    >
      <ForgotPasswordForm />
    </AuthCard>
  );
}
