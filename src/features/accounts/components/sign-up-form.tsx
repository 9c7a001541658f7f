import { useState, type FormEvent } from "react";
import { signUpSchema, type CurrentUser } from "@shared/accounts/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { ChoiceGroup } from "@/components/ui/choice-group.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { ZipZoneNote } from "./zip-zone-note.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { readForm } from "@/lib/read-form.ts";
import { useSignUp } from "../api/sign-up.ts";

const labels = {
  kind: "Your company is",
  companyName: "Company legal name",
  addressLine: "Mailing address",
  postalCode: "ZIP code",
  timeZone: "Time zone",
  name: "Your name",
  email: "E-mail",
  password: "Password",
};

const plainWords = { kind: "Choose what kind of company you are" };

const kindOptions = [
  { value: "service", label: "A field-service company", hint: "Your technicians keep machine tools running" },
  { value: "shop", label: "A machine shop", hint: "You hire technicians for your machines" },
];

export function SignUpForm({ onSignedUp }: { onSignedUp: (user: CurrentUser) => void }) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const [zip, setZip] = useState("");
  const signUp = useSignUp();
  const problem = invalid ?? signUp.error;
  const fields = fieldErrorsOf(problem, plainWords);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = signUpSchema.safeParse(readForm(event.currentTarget));
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    signUp.mutate(parsed.data, { onSuccess: onSignedUp });
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-5">
      <FormError error={problem} labels={labels} plainWords={plainWords} />
      <ChoiceGroup
        legend={labels.kind}
        name="kind"
        options={kindOptions}
        defaultValue="service"
        error={fields.kind}
      />
      <fieldset className="space-y-4">
        <legend className="text-base font-semibold text-ink-900">Company</legend>
        <TextField
          label={labels.companyName}
          name="companyName"
          autoComplete="organization"
          required
          error={fields.companyName}
        />
        <TextField
          label={labels.addressLine}
          name="addressLine"
          autoComplete="street-address"
          required
          error={fields.addressLine}
        />
        <TextField
          label={labels.postalCode}
          name="postalCode"
          inputMode="numeric"
          autoComplete="postal-code"
          maxLength={5}
          onChange={(event) => setZip(event.currentTarget.value.trim())}
          hint="Your time zone is set from this ZIP code: a policy period runs on standard time at the insured's mailing address."
          required
          error={fields.postalCode}
        />
        <ZipZoneNote zip={zip} />
      </fieldset>
      <fieldset className="space-y-4">
        <legend className="text-base font-semibold text-ink-900">You</legend>
        <TextField label={labels.name} name="name" autoComplete="name" required error={fields.name} />
        <TextField
          label={labels.email}
          name="email"
          type="email"
          autoComplete="email"
          required
          error={fields.email}
        />
        <TextField
          label={labels.password}
          name="password"
          type="password"
          autoComplete="new-password"
          hint="At least 10 characters."
          required
          error={fields.password}
        />
      </fieldset>
      <Button
        type="submit"
        pending={signUp.isPending}
        pendingLabel="Creating your account…"
        className="w-full"
      >
        Create account
      </Button>
    </form>
  );
}
