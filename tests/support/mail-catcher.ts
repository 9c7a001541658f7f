import { startSmtpCatcher, type CaughtMessage } from "../../server/mail/smtp-catcher.ts";
import { createSmtpMailer } from "../../server/mail/mailer.ts";
import { deliverDueMail } from "../../server/mail/outbox.ts";
import { useForFile } from "./suite-hooks.ts";

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
    // Other tests may have left mail queued: send rounds until nothing due is left.
    async deliver(now?: Date) {
      const total = { sent: 0, retried: 0, failed: 0 };
      for (;;) {
        const round = await deliverDueMail(mailer, "Clearbench <no-reply@clearbench.test>", now, 200);
        total.sent += round.sent;
        total.retried += round.retried;
        total.failed += round.failed;
        if (round.sent + round.retried + round.failed === 0) return total;
      }
    },
    to: (address: string) => messages.filter((m) => m.to.includes(address)),
    async close() {
      mailer.close();
      await catcher.close();
    },
  };
}

export type TestMailCatcher = Awaited<ReturnType<typeof startTestMailCatcher>>;

/** A mail catcher for the whole file: started in beforeAll, closed in afterAll. */
export function useMailCatcher(): TestMailCatcher {
  return useForFile("the mail catcher", startTestMailCatcher, (catcher) => catcher.close());
}
