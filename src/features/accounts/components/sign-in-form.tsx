import { useState, type FormEvent } from "react";
import { signInSchema, type CurrentUser } from "@shared/accounts/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { readForm } from "@/lib/read-form.ts";
import { useSignIn } from "../api/sign-in.ts";

const labels = { email: "E-mail", password: "Password" };

export function SignInForm({ onSignedIn }: { onSignedIn: (user: CurrentUser) => void }) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const signIn = useSignIn();
  const problem = invalid ?? signIn.error;
  const fields = fieldErrorsOf(problem);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = signInSchema.safeParse(readForm(event.currentTarget));
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    signIn.mutate(parsed.data, { onSuccess: onSignedIn });
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4">
      <FormError error={problem} labels={labels} />
      <TextField
        label={labels.email}
        name="email"
        type="email"
        autoComplete="username"
        required
        error={fields.email}
      />
      <TextField
        label={labels.password}
        name="password"
        type="password"
        autoComplete="current-password"
        required
        error={fields.password}
      />
      <Button type="submit" pending={signIn.isPending} pendingLabel="Signing in…" className="w-full">
        Sign in
      </Button>
    </form>
  );
}
