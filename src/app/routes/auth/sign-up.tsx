import { useNavigate } from "react-router-dom";
import type { CurrentUser } from "@shared/accounts/schemas.ts";
import { homePathByRole } from "@/config/navigation.ts";
import { paths } from "@/config/paths.ts";
import { SignUpForm } from "@/features/accounts/components/sign-up-form.tsx";
import { AuthCard } from "./auth-card.tsx";
import { AuthLink } from "./auth-link.tsx";

export function Component() {
  const navigate = useNavigate();
  const goHome = (user: CurrentUser) => navigate(homePathByRole[user.role], { replace: true });

  return (
    <AuthCard
      wide
      title="Create a company account"
      intro="For field-service companies and the machine shops that hire them. You become your company's first user."
      footer={
        <p>
          Already have an account? <AuthLink to={paths.auth.signIn}>Sign in</AuthLink>
        </p>
      }
    >
      <SignUpForm onSignedUp={goHome} />
    </AuthCard>
  );
}
