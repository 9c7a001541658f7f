import { useState, type FormEvent } from "react";
import { setPasswordSchema } from "@shared/accounts/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { readForm } from "@/lib/read-form.ts";
import { useSetPassword } from "../api/set-password.ts";

const labels = { password: "New password", token: "Link" };

/** One password field with a show toggle rather than a second "repeat" field to mistype. */
export function SetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const [shown, setShown] = useState(false);
  const setPassword = useSetPassword();
  const problem = invalid ?? setPassword.error;
  const fields = fieldErrorsOf(problem);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = setPasswordSchema.safeParse({ ...readForm(event.currentTarget), token });
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    setPassword.mutate(parsed.data, { onSuccess: onDone });
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4">
      <FormError error={problem} labels={labels} />
      <TextField
        label={labels.password}
        name="password"
        type={shown ? "text" : "password"}
        autoComplete="new-password"
        hint="At least 10 characters."
        required
        error={fields.password}
      />
      <label className="flex min-h-10 items-center gap-2 text-sm text-ink-900">
        <input
          type="checkbox"
          checked={shown}
          onChange={(e) => setShown(e.target.checked)}
          className="size-4 accent-ink-700"
        />
        Show the password as I type
      </label>
      <Button type="submit" pending={setPassword.isPending} pendingLabel="Saving…" className="w-full">
        Set password
      </Button>
    </form>
  );
}
