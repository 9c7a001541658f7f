import { useState, type FormEvent } from "react";
import { holderRoleLabels, holderRoles, type HolderRole } from "@shared/credentials/broker-schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { ChoiceGroup } from "@/components/ui/choice-group.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { useAskForCertificate } from "../api/certificate-requests.ts";

const roleHints: Record<HolderRole, string> = {
  certificate_holder: "You are told of the coverage and of changes to it.",
  additional_insured: "The policy covers your shop too; the insurer grants it by an endorsement.",
};

/** The shop's ask: which company, which coverage, and how the shop is to be named on the certificate. */
export function AskForCertificateForm({
  companies,
  coverages,
}: {
  companies: readonly { id: number; name: string }[];
  coverages: readonly { code: string; name: string }[];
}) {
  const ask = useAskForCertificate();
  const [companyId, setCompanyId] = useState("");
  const [typeCode, setTypeCode] = useState("");
  const errors = fieldErrorsOf(ask.error);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const role = new FormData(event.currentTarget).get("holderRole");
    ask.mutate({
      serviceCompanyId: Number(companyId),
      typeCode,
      holderRole: (role ?? "certificate_holder") as HolderRole,
    });
  };

  return (
    <form onSubmit={onSubmit} noValidate aria-labelledby="ask-heading" className="space-y-4">
      <h2 id="ask-heading" className="text-lg font-semibold text-ink-900">
        Ask for a certificate
      </h2>
      <FormError
        error={ask.error}
        labels={{ serviceCompanyId: "Service company", typeCode: "Coverage", holderRole: "Name my shop as" }}
      />
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label="Service company"
          name="serviceCompanyId"
          placeholder="Choose a company"
          value={companyId}
          options={companies.map((c) => ({ value: String(c.id), label: c.name }))}
          onChange={(e) => setCompanyId(e.currentTarget.value)}
          error={errors.serviceCompanyId}
          hint="Companies on your roster or in your work orders."
        />
        <SelectField
          label="Coverage"
          name="typeCode"
          placeholder="Choose a coverage"
          value={typeCode}
          options={coverages.map((c) => ({ value: c.code, label: c.name }))}
          onChange={(e) => setTypeCode(e.currentTarget.value)}
          error={errors.typeCode}
        />
      </div>
      <ChoiceGroup
        legend="Name my shop as"
        name="holderRole"
        defaultValue="certificate_holder"
        options={holderRoles.map((r) => ({ value: r, label: holderRoleLabels[r], hint: roleHints[r] }))}
        error={errors.holderRole}
      />
      <div className="flex flex-wrap items-center gap-3">
        <Button
          type="submit"
          disabled={!companyId || !typeCode}
          pending={ask.isPending}
          pendingLabel="Sending"
        >
          Send the request
        </Button>
        {ask.isSuccess && (
          <span role="status" className="text-sm text-ink-700">
            Sent to {ask.data.companyName}'s broker. You will be told when it is verified.
          </span>
        )}
      </div>
    </form>
  );
}
