import type { MailDraft } from "./outbox.ts";

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c,
  );

export interface MailContent {
  to: string;
  subject: string;
  /** "Hello Dana," when the name is known. */
  greetName?: string | undefined;
  /** What happened, one paragraph each. */
  paragraphs: readonly string[];
  /** The one thing to do next, said in a sentence and offered as the one link. */
  next: { sentence: string; label: string; url: string };
  /** Small print after the link (e.g. "If it was not you, ignore this message."). */
  after?: readonly string[] | undefined;
}

/**
 * Every e-mail has the same shape: what happened, the one next step, and one absolute link, in a plain-text part and an
 * HTML part. A relative link would open nothing from a mail client, so it is refused here rather than sent.
 */
export function composeMail(content: MailContent): MailDraft {
  if (!/^https?:\/\//.test(content.next.url))
    throw new Error(`E-mail links must be absolute: ${content.next.url}`);
  const greeting = content.greetName ? [`Hello ${content.greetName},`] : [];
  const after = content.after ?? [];
  const text = [
    ...greeting,
    ...content.paragraphs,
    content.next.sentence,
    `${content.next.label}: ${content.next.url}`,
    ...after,
    "Clearbench",
  ].join("\n\n");
  const html = [
    ...greeting.map((g) => `<p>${escapeHtml(g)}</p>`),
    ...content.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    `<p><strong>${escapeHtml(content.next.sentence)}</strong></p>`,
    `<p><a href="${escapeHtml(content.next.url)}">${escapeHtml(content.next.label)}</a></p>`,
    ...after.map((p) => `<p><small>${escapeHtml(p)}</small></p>`),
    "<p>Clearbench</p>",
  ].join("\n");
  return {
    to: content.to,
    subject: content.subject,
    text,
    html,
    summary: content.paragraphs.join(" "),
    link: content.next.url,
  };
}
