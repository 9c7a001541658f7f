import type { MailDraft } from "../mail/outbox.ts";

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c,
  );

export function verifiedMail(to: string, typeName: string, holderName: string, link: string): MailDraft {
  return {
    to,
    subject: `Verified: ${typeName} for ${holderName}`,
    text: `A compliance reviewer verified the ${typeName} for ${holderName}.\n\nSee it here: ${link}\n\nClearbench`,
    html: `<p>A compliance reviewer verified the <strong>${escapeHtml(typeName)}</strong> for ${escapeHtml(holderName)}.</p><p><a href="${escapeHtml(link)}">See it in Clearbench</a></p>`,
  };
}

export function returnedMail(
  to: string,
  typeName: string,
  holderName: string,
  reason: string,
  link: string,
): MailDraft {
  return {
    to,
    subject: `Returned: ${typeName} for ${holderName}`,
    text: `A compliance reviewer returned the ${typeName} for ${holderName}.\n\nReason: ${reason}\n\nSubmit a corrected one here: ${link}\n\nClearbench`,
    html: `<p>A compliance reviewer returned the <strong>${escapeHtml(typeName)}</strong> for ${escapeHtml(holderName)}.</p><p>Reason: ${escapeHtml(reason)}</p><p><a href="${escapeHtml(link)}">Submit a corrected one</a></p>`,
  };
}
