import { useState, type FormEvent } from "react";
import { z } from "zod";
import { emailSchema } from "@shared/accounts/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import type { TechnicianDto as Technician } from "@shared/technicians/schemas.ts";
import { useGiveSignIn } from "../api/give-sign-in.ts";

const giveSignInSchema = z.object({ email: emailSchema });

/** Invites the technician to a sign-in of their own, so they can upload their cards and see their standing. */
export function GiveSignInForm({ technician }: { technician: Technician }) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const give = useGiveSignIn();
  const problem = invalid ?? give.error;
  const fields = fieldErrorsOf(problem);

  if (technician.hasAccount) {
    return <p className="text-sm text-ink-700">{technician.name} has a sign-in of their own.</p>;
  }

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = giveSignInSchema.safeParse({ email: new FormData(event.currentTarget).get("email") });
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    give.mutate(
      { id: technician.id, email: parsed.data.email },
      { onSuccess: () => setSentTo(parsed.data.email) },
    );
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-3" aria-labelledby="sign-in-heading">
      <h3 id="sign-in-heading" className="font-semibold text-ink-900">
        Give sign-in
      </h3>
      {sentTo && (
        <p role="status" className="rounded-md border-l-4 border-emerald-700 bg-emerald-50 px-3 py-2 text-sm">
          Invitation sent to {sentTo}.
        </p>
      )}
      <FormError error={problem} labels={{ email: "E-mail for the sign-in" }} />
      <TextField
        label="E-mail for the sign-in"
        name="email"
        type="email"
        autoComplete="off"
        defaultValue={technician.email ?? ""}
        error={fields.email}
      />
      <Button type="submit" variant="secondary" pending={give.isPending} pendingLabel="Sending…">
        Send the invitation
      </Button>
    </form>
  );
}
