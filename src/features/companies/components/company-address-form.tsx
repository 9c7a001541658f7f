import { useState, type FormEvent } from "react";
import { companyAddressSchema } from "@shared/accounts/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { readForm } from "@/lib/read-form.ts";
import { useChangeCompanyAddress, type CompanyProfile } from "../api/company-profile.ts";

const labels = { addressLine: "Mailing address", postalCode: "ZIP code" };

/** The mailing address; the time zone is shown, never chosen: it follows the ZIP code. */
export function CompanyAddressForm({ profile }: { profile: CompanyProfile }) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const change = useChangeCompanyAddress();
  const problem = invalid ?? change.error;
  const fields = fieldErrorsOf(problem);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = companyAddressSchema.safeParse(readForm(event.currentTarget));
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    change.mutate(parsed.data);
  };

  return (
    <form noValidate onSubmit={submit} className="max-w-xl space-y-4">
      <FormError error={problem} labels={labels} />
      <TextField
        label={labels.addressLine}
        name="addressLine"
        autoComplete="street-address"
        defaultValue={profile.addressLine ?? ""}
        required
        error={fields.addressLine}
      />
      <TextField
        label={labels.postalCode}
        name="postalCode"
        inputMode="numeric"
        autoComplete="postal-code"
        maxLength={5}
        defaultValue={profile.postalCode ?? ""}
        required
        error={fields.postalCode}
      />
      <p className="text-sm text-ink-800" aria-live="polite">
        Time zone: <span className="font-semibold">{profile.timeZone}</span>
        {profile.city && profile.state ? ` (${profile.city}, ${profile.state})` : ""}. It follows the ZIP
        code: policy periods run on standard time at the insured's mailing address.
      </p>
      <Button type="submit" pending={change.isPending} pendingLabel="Saving…">
        Save address
      </Button>
    </form>
  );
}
