import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { buildTestApp, type TestApp } from "../support/test-app.ts";
import { startTestMailCatcher } from "../support/mail-catcher.ts";
import { createSmtpMailer, enqueueMail, OutboxMessage } from "../../server/mail/index.ts";
import { CLAIM_LEASE_MS, deliverDueMail, outboxMessageId } from "../../server/mail/outbox.ts";
import { deliverAll } from "./job-support.ts";

let t: TestApp;
let catcher: Awaited<ReturnType<typeof startTestMailCatcher>>;
beforeAll(async () => {
  t = buildTestApp();
  catcher = await startTestMailCatcher();
  // Whatever earlier tests left queued goes out first, so only this test's messages are due below.
  await deliverAll(catcher);
});
afterAll(async () => {
  await catcher.close();
  await t.close();
});

const FROM = "Clearbench <no-reply@clearbench.test>";

class SimulatedCrash extends Error {}

describe("outbox delivery across a crash", () => {
  it("sends the message whose mark a crash interrupted again with the same Message-ID, and every other once", async () => {
    const domain = `crash-${randomUUID().slice(0, 8)}.test`;
    for (let i = 0; i < 5; i += 1) {
      await enqueueMail({ to: `person${i}@${domain}`, subject: `Notice ${i}`, text: `Body ${i}` });
    }
    const queued = await OutboxMessage.findAll({ order: [["id", "ASC"]] }).then((all) =>
      all.filter((m) => m.toAddress.endsWith(domain)),
    );
    const victim = queued[2]!;
    const mailer = createSmtpMailer(catcher.url);
    const t0 = new Date(Date.now() + 1_000);
    const mine = () => catcher.messages.filter((m) => m.to.endsWith(domain));

    // The sender dies after handing message 3 to SMTP and before marking it sent.
    const crashed = deliverDueMail(mailer, FROM, t0, 50, {
      afterSend: (message) => {
        if (message.id === victim.id) throw new SimulatedCrash("killed between send and mark");
      },
    });
    await expect(crashed).rejects.toBeInstanceOf(SimulatedCrash);
    const afterCrash = mine().length;
    // A restarted sender inside the lease leaves the interrupted message alone and sends the rest.
    const restarted = await deliverDueMail(mailer, FROM, new Date(t0.getTime() + 1_000));
    const beforeLease = mine().length;
    // Once the lease has run out the interrupted message is sent again.
    const afterLease = await deliverDueMail(mailer, FROM, new Date(t0.getTime() + CLAIM_LEASE_MS + 1_000));
    const again = await deliverDueMail(mailer, FROM, new Date(t0.getTime() + 10 * CLAIM_LEASE_MS));
    mailer.close();

    expect(afterCrash).toBe(3);
    expect(restarted.sent).toBe(2);
    expect(beforeLease).toBe(5);
    expect(afterLease.sent).toBe(1);
    expect(again.sent).toBe(0);
    const byId = new Map<string, number>();
    for (const m of mine()) byId.set(m.messageId ?? "none", (byId.get(m.messageId ?? "none") ?? 0) + 1);
    const expected = new Map(queued.map((m) => [outboxMessageId(m, FROM), m.id === victim.id ? 2 : 1]));
    expect(byId).toEqual(expected);
    const states = await OutboxMessage.findAll({ where: { id: queued.map((m) => m.id) } });
    expect(states.every((m) => m.status === "sent")).toBe(true);
  });

  it("lets two senders running at once send each message exactly once", async () => {
    const domain = `pair-${randomUUID().slice(0, 8)}.test`;
    for (let i = 0; i < 12; i += 1) {
      await enqueueMail({ to: `person${i}@${domain}`, subject: `Notice ${i}`, text: `Body ${i}` });
    }
    const a = createSmtpMailer(catcher.url);
    const b = createSmtpMailer(catcher.url);
    const now = new Date(Date.now() + 1_000);

    const [ra, rb] = await Promise.all([deliverDueMail(a, FROM, now), deliverDueMail(b, FROM, now)]);
    a.close();
    b.close();

    const mine = catcher.messages.filter((m) => m.to.endsWith(domain));
    expect(ra.sent + rb.sent).toBe(12);
    expect(new Set(mine.map((m) => m.messageId)).size).toBe(12);
    expect(mine).toHaveLength(12);
  });
});
