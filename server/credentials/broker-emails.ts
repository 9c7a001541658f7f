import type { HolderRole } from "../../shared/credentials/broker-schemas.ts";
import { composeMail, type MailDraft } from "../mail/index.ts";

export interface BrokerMailFacts {
  to: string;
  contactName: string;
  companyName: string;
  coverageName: string;
  certificateHolder: string | null;
  holderRole?: HolderRole;
  expiresAt: string;
  link: string;
}

// Additional insured status comes from an endorsement to the policy; the certificate can only report it.
const holderSentence = (holder: string | null, role: HolderRole = "certificate_holder") =>
  !holder
    ? undefined
    : role === "additional_insured"
      ? `Please name ${holder} as certificate holder and show it as additional insured, with the endorsement that grants it.`
      : `Please name ${holder} as certificate holder on it.`;

export function brokerRequestMail(f: BrokerMailFacts): MailDraft {
  return composeMail({
    to: f.to,
    subject: `Certificate requested: ${f.coverageName} for ${f.companyName}`,
    greetName: f.contactName,
    paragraphs: [
      `${f.companyName} asks you, as its insurance broker, for a current certificate of insurance for its ${f.coverageName}.`,
      ...[holderSentence(f.certificateHolder, f.holderRole)].filter((s): s is string => Boolean(s)),
    ],
    next: {
      sentence: `Upload the certificate as one PDF through this link; no account is needed. The link works once and until ${f.expiresAt}.`,
      label: "Upload the certificate",
      url: f.link,
    },
    after: [
      "If you are not this company's broker, ignore this message; nothing is shared without an upload.",
    ],
  });
}

export function brokerReminderMail(f: BrokerMailFacts & { lapsesOn: string }): MailDraft {
  return composeMail({
    to: f.to,
    subject: `Reminder: certificate for ${f.companyName} (${f.coverageName}) lapses ${f.lapsesOn}`,
    greetName: f.contactName,
    paragraphs: [
      `${f.companyName}'s ${f.coverageName} on file lapses ${f.lapsesOn}, and no renewed certificate has arrived yet.`,
      ...[holderSentence(f.certificateHolder, f.holderRole)].filter((s): s is string => Boolean(s)),
    ],
    next: {
      sentence: `Upload the renewed certificate as one PDF; the link works once and until ${f.expiresAt}.`,
      label: "Upload the certificate",
      url: f.link,
    },
  });
}

export function shopCertificateMail(
  to: string,
  companyName: string,
  coverageName: string,
  link: string,
  role: HolderRole = "certificate_holder",
): MailDraft {
  const naming =
    role === "additional_insured" ? "certificate holder and additional insured" : "certificate holder";
  return composeMail({
    to,
    subject: `Verified: ${coverageName} certificate from ${companyName}`,
    paragraphs: [
      `The certificate of insurance ${companyName} was asked for (${coverageName}, naming your shop as ${naming}) came from their broker and a compliance reviewer verified it.`,
      "Confirm the terms with your own insurer or broker if your contract asks for more than the certificate shows.",
    ],
    next: {
      sentence: "See the company's standing on Clearbench.",
      label: "Open Clearbench",
      url: link,
    },
  });
}
