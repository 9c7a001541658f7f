import { composeMail, type MailDraft } from "../mail/index.ts";

export function verifiedMail(to: string, typeName: string, holderName: string, link: string): MailDraft {
  return composeMail({
    to,
    subject: `Verified: ${typeName} for ${holderName}`,
    paragraphs: [
      `A compliance reviewer verified the ${typeName} for ${holderName}. It now counts toward standing.`,
    ],
    next: {
      sentence: "Nothing more is needed for this document; you will be reminded before it lapses.",
      label: "See your documents",
      url: link,
    },
  });
}

export function returnedMail(
  to: string,
  typeName: string,
  holderName: string,
  reason: string,
  link: string,
): MailDraft {
  return composeMail({
    to,
    subject: `Returned: ${typeName} for ${holderName}`,
    paragraphs: [
      `A compliance reviewer returned the ${typeName} for ${holderName}. It does not count until a corrected one is verified.`,
      `Reason: ${reason}`,
    ],
    next: {
      sentence: "Upload a corrected document; a reviewer will check it again.",
      label: "Upload a corrected document",
      url: link,
    },
  });
}
