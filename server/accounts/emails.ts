import { composeMail, type MailDraft } from "../mail/index.ts";

const roleWords: Record<string, string> = {
  admin: "an administrator",
  reviewer: "a compliance reviewer",
  provider_admin: "the office administrator",
  technician: "a technician",
  buyer: "a buyer",
};

export function inviteMail(
  to: string,
  name: string,
  companyName: string,
  link: string,
  role: string,
): MailDraft {
  const as = ` as ${roleWords[role] ?? role}`;
  return composeMail({
    to,
    subject: `You are invited to Clearbench${as}`,
    greetName: name,
    paragraphs: [`You have been given a Clearbench account for ${companyName}${as}.`],
    next: {
      sentence: "Set your password to sign in. The link works once, for 7 days.",
      label: "Set your password",
      url: link,
    },
  });
}

export function resetMail(to: string, name: string, link: string): MailDraft {
  return composeMail({
    to,
    subject: "Reset your Clearbench password",
    greetName: name,
    paragraphs: ["Someone asked to reset the password of this account."],
    next: {
      sentence: "If it was you, choose a new password within one hour. The link works once.",
      label: "Choose a new password",
      url: link,
    },
    after: ["If it was not you, ignore this message; your password stays as it is."],
  });
}
