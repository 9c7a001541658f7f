import { useState, type FormEvent } from "react";
import { inviteUserSchema, roles } from "@shared/accounts/schemas.ts";
import { roleLabels } from "@/config/navigation.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { readForm } from "@/lib/read-form.ts";
import type { AdminCompany } from "../api/get-companies.ts";
import { useInviteUser } from "../api/invite-user.ts";

const labels = { email: "E-mail", name: "Name", role: "Role", companyId: "Company" };

// inviteUserSchema carries no messages of its own for these.
const plainWords = { name: "Enter their name", role: "Choose a role", companyId: "Choose a company" };

const kindWords: Record<AdminCompany["kind"], string> = {
  service: "service company",
  shop: "machine shop",
  platform: "platform",
};

const roleOptions = roles.map((role) => ({ value: role, label: roleLabels[role] }));

export function InviteUserForm({ companies }: { companies: AdminCompany[] }) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const [invited, setInvited] = useState<string | null>(null);
  const invite = useInviteUser();
  const problem = invalid ?? invite.error;
  const fields = fieldErrorsOf(problem, plainWords);
  const companyOptions = companies.map((c) => ({
    value: String(c.id),
    label: `${c.name} (${kindWords[c.kind]})`,
  }));

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const parsed = inviteUserSchema.safeParse(readForm(form));
    setInvited(null);
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    invite.mutate(parsed.data, {
      onSuccess: () => {
        setInvited(parsed.data.email);
        form.reset();
      },
    });
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-labelledby="invite-heading">
      <h2 id="invite-heading" className="text-lg font-semibold text-ink-900">
        Invite a user
      </h2>
      {invited && (
        <p
          role="status"
          className="rounded-md border-l-4 border-emerald-700 bg-emerald-50 px-4 py-3 text-sm text-ink-900"
        >
          Invitation sent to {invited}. The e-mail holds a link to choose a password.
        </p>
      )}
      <FormError error={problem} labels={labels} plainWords={plainWords} />
      <TextField
        label={labels.email}
        name="email"
        type="email"
        autoComplete="off"
        required
        error={fields.email}
      />
      <TextField label={labels.name} name="name" autoComplete="off" required error={fields.name} />
      <SelectField
        label={labels.companyId}
        name="companyId"
        options={companyOptions}
        placeholder="Choose a company"
        defaultValue=""
        required
        error={fields.companyId}
      />
      <SelectField
        label={labels.role}
        name="role"
        options={roleOptions}
        placeholder="Choose a role"
        defaultValue=""
        hint="Service companies: admin or technician. Machine shops: buyer."
        required
        error={fields.role}
      />
      <Button type="submit" pending={invite.isPending} pendingLabel="Sending…">
        Send invitation
      </Button>
    </form>
  );
}
