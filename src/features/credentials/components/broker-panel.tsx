import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import type { CredentialDto as Credential } from "@shared/credentials/credential-shapes.ts";
import {
  useBrokerContacts,
  useBrokerRequests,
  useRequestBrokerCertificate,
  useSaveBrokerContact,
  type BrokerRequest,
} from "../api/broker-requests.ts";

const day = (iso: string) => new Intl.DateTimeFormat("en-US", { dateStyle: "medium" }).format(new Date(iso));

function requestState(r: BrokerRequest): string {
  if (r.linkState === "used") return `received ${day(r.usedAt!)}`;
  if (r.linkState === "expired") return "link expired";
  return `waiting, link open until ${day(r.expiresAt)}`;
}

/** The office's broker, and certificates asked of them: the broker uploads through a one-time link. */
export function BrokerPanel({ coverages }: { coverages: readonly Credential[] }) {
  const contacts = useBrokerContacts();
  const requests = useBrokerRequests();
  const save = useSaveBrokerContact();
  const ask = useRequestBrokerCertificate();
  const companyBroker = contacts.data?.find((c) => c.typeCode === null);
  const [coverageId, setCoverageId] = useState("");
  const errors = fieldErrorsOf(save.error);

  const onSave = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    save.mutate({
      agency: String(form.get("agency") ?? ""),
      contactName: String(form.get("contactName") ?? ""),
      email: String(form.get("email") ?? ""),
    });
  };
  const onAsk = (event: FormEvent) => {
    event.preventDefault();
    if (coverageId) ask.mutate({ credentialId: Number(coverageId) });
  };

  return (
    <section aria-labelledby="broker-heading" className="mt-8 rounded-md border border-ink-100 bg-white p-4">
      <h2 id="broker-heading" className="text-lg font-semibold text-ink-900">
        Certificates from your broker
      </h2>
      <p className="mt-1 text-sm text-ink-700">
        Your broker gets a one-time link by e-mail and uploads the renewed certificate without an account; it
        arrives here for you to check, then a reviewer verifies it.
      </p>
      <form
        onSubmit={onSave}
        noValidate
        className="mt-4 grid gap-3 sm:grid-cols-3"
        key={companyBroker?.id ?? 0}
      >
        <div className="sm:col-span-3">
          <FormError
            error={save.error}
            labels={{ agency: "Agency", contactName: "Contact", email: "E-mail" }}
          />
        </div>
        <TextField label="Agency" name="agency" defaultValue={companyBroker?.agency} error={errors.agency} />
        <TextField
          label="Contact"
          name="contactName"
          defaultValue={companyBroker?.contactName}
          error={errors.contactName}
        />
        <TextField
          label="E-mail"
          name="email"
          type="email"
          defaultValue={companyBroker?.email}
          error={errors.email}
        />
        <div className="sm:col-span-3">
          <Button type="submit" variant="secondary" pending={save.isPending} pendingLabel="Saving">
            Save broker
          </Button>
          {save.isSuccess && (
            <span role="status" className="ml-3 text-sm text-ink-700">
              Saved.
            </span>
          )}
        </div>
      </form>
      {companyBroker && coverages.length > 0 && (
        <form onSubmit={onAsk} noValidate className="mt-4 flex flex-wrap items-end gap-3">
          <SelectField
            label="Ask for a renewed certificate of"
            name="coverage"
            value={coverageId}
            placeholder="Choose a coverage"
            options={coverages.map((c) => ({ value: String(c.id), label: c.typeName }))}
            onChange={(e) => setCoverageId(e.currentTarget.value)}
            className="w-72"
          />
          <Button type="submit" disabled={!coverageId} pending={ask.isPending} pendingLabel="Sending">
            Send the broker a link
          </Button>
          <FormError error={ask.error} />
        </form>
      )}
      {(requests.data?.length ?? 0) > 0 && (
        <ul className="mt-4 space-y-1 text-sm text-ink-900">
          {requests.data!.slice(0, 10).map((r) => (
            <li key={r.id}>
              {r.coverageName} from {r.contactName} ({r.agency}), sent {day(r.createdAt)}: {requestState(r)}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
