import type { MailDraft } from "../mail/outbox.ts";

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c,
  );

export function inviteMail(to: string, name: string, companyName: string, link: string): MailDraft {
  return {
    to,
    subject: "You are invited to Clearbench",
    text: `Hello ${name},\n\nYou have been given a Clearbench account for ${companyName}.\nSet your password here (the link works once, for 7 days):\n${link}\n\nClearbench`,
    html: `<p>Hello ${escapeHtml(name)},</p><p>You have been given a Clearbench account for ${escapeHtml(companyName)}.</p><p><a href="${escapeHtml(link)}">Set your password</a> (the link works once, for 7 days).</p>`,
  };
}

export function resetMail(to: string, name: string, link: string): MailDraft {
  return {
    to,
    subject: "Reset your Clearbench password",
    text: `Hello ${name},\n\nSomeone asked to reset the password of this account. If it was you, use this link within one hour (it works once):\n${link}\n\nIf it was not you, ignore this message.\n\nClearbench`,
    html: `<p>Hello ${escapeHtml(name)},</p><p>Someone asked to reset the password of this account. If it was you, <a href="${escapeHtml(link)}">choose a new password</a> within one hour (the link works once).</p><p>If it was not you, ignore this message.</p>`,
  };
}
