import { useState, type FormEvent } from "react";
import { requestPasswordResetSchema } from "@shared/accounts/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { readForm } from "@/lib/read-form.ts";
import { useRequestPasswordReset } from "../api/request-password-reset.ts";

export function ForgotPasswordForm() {
  const [invalid, setInvalid] = useState<unknown>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const request = useRequestPasswordReset();
  const problem = invalid ?? request.error;
  const fields = fieldErrorsOf(problem);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = requestPasswordResetSchema.safeParse(readForm(event.currentTarget));
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    request.mutate(parsed.data, { onSuccess: () => setSentTo(parsed.data.email) });
  };

  if (sentTo) {
    // The same words whether or not the address has an account, as the server's answer is the same.
    return (
      <div
        role="status"
        className="space-y-2 rounded-md border border-ink-100 bg-ink-50 px-4 py-3 text-ink-900"
      >
        <p className="font-semibold">Check your e-mail</p>
        <p className="text-sm">
          If an account uses {sentTo}, we have sent it a link to choose a new password. The link works once.
        </p>
      </div>
    );
  }

  return (
    <form noValidate onSubmit={submit} className="space-y-4">
      <FormError error={problem} labels={{ email: "E-mail" }} />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        required
        error={fields.email}
      />
      <Button type="submit" pending={request.isPending} pendingLabel="Sending…" className="w-full">
        Send reset link
      </Button>
    </form>
  );
}
