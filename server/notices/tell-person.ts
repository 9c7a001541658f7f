import type { Transaction } from "sequelize";
import { User } from "../accounts/index.ts";
import { enqueueMail, type MailDraft } from "../mail/index.ts";
import { Notification } from "./model.ts";

/** What the bell shows for one e-mail: its subject as the title, what happened as the body, the mail's link. */
export interface BellWords {
  kind: string;
  /** Defaults to the mail's subject. */
  title?: string;
  /** Defaults to the mail's first paragraph. */
  body?: string;
  /** Defaults to the link the mail offers; the client keeps only its path. */
  link?: string | null;
}

const TITLE_MAX = 300;

function firstParagraph(text: string): string {
  return text.split(/\n\s*\n/).find((p) => p.trim() !== "" && !/^Hello .*,$/.test(p.trim())) ?? text;
}

/**
 * The one way news reaches a person: the e-mail is queued and, when the address belongs to an active user, the same
 * news lands in that user's bell, both in the caller's transaction. Outside addresses (a broker) have no bell and get
 * the mail alone. Account mail carrying a one-time token (reset, invite) is queued with enqueueMail instead, so the
 * token never sits in a list.
 */
export async function tellPerson(draft: MailDraft, bell: BellWords, transaction: Transaction): Promise<void> {
  await enqueueMail(draft, transaction);
  const user = await User.findOne({
    where: { email: draft.to.toLowerCase(), active: true },
    attributes: ["id"],
    transaction,
  });
  if (!user) return;
  await Notification.create(
    {
      userId: user.id,
      kind: bell.kind,
      title: (bell.title ?? draft.subject).slice(0, TITLE_MAX),
      body: bell.body ?? draft.summary ?? firstParagraph(draft.text),
      link: bell.link !== undefined ? bell.link : (draft.link ?? null),
      noticeId: null,
    },
    { transaction },
  );
}
