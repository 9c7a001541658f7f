import { startSmtpCatcher, type CaughtMessage } from "../../server/mail/smtp-catcher.ts";
import { createSmtpMailer } from "../../server/mail/mailer.ts";
import { deliverDueMail } from "../../server/mail/outbox.ts";

/** A real SMTP server on loopback; `deliver()` runs the outbox sender against it. */
export async function startTestMailCatcher() {
  const messages: CaughtMessage[] = [];
  const catcher = await startSmtpCatcher((m) => {
    messages.push(m);
  });
  const mailer = createSmtpMailer(catcher.url);
  return {
    messages,
    url: catcher.url,
    deliver: (now?: Date) => deliverDueMail(mailer, "Clearbench <no-reply@clearbench.test>", now),
    to: (address: string) => messages.filter((m) => m.to.includes(address)),
    async close() {
      mailer.close();
      await catcher.close();
    },
  };
}
