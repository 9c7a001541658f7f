import { describe, expect, it } from "vitest";
import { Op } from "sequelize";
import { useTestApp } from "../../support/test-app.ts";
import { buildWorkOrderWorld, raiseBody, acceptBody } from "../../fixtures/build-work-order-world.ts";
import { OutboxMessage } from "../../../server/mail/model.ts";
import { inviteMail } from "../../../server/accounts/emails.ts";
import { composeMail } from "../../../server/mail/index.ts";

const t = useTestApp();

const mailsTo = (address: string, workOrderId: number) =>
  OutboxMessage.findAll({
    where: { toAddress: address, subject: { [Op.like]: `Work order #${workOrderId}:%` } },
    order: [["id", "ASC"]],
  });

function expectActionable(mail: { textBody: string; htmlBody: string | null }) {
  expect(mail.htmlBody).not.toBeNull();
  expect(mail.textBody).toMatch(/https?:\/\/[^\s/]+\/work-orders\/\d+/);
  expect(mail.htmlBody).toMatch(/<a href="https?:\/\/[^"]+\/work-orders\/\d+">/);
  // The next step is said in bold in HTML and as its own paragraph in text, before the link.
  expect(mail.htmlBody).toMatch(/<p><strong>[^<]+<\/strong><\/p>/);
}

describe("work-order e-mails say what to do next", () => {
  it("asks the service company to accept or decline a new request", async () => {
    const world = await buildWorkOrderWorld(t.app);

    const raised = await world.shop.agent.post("/api/work-orders").send(raiseBody(world));

    const [mail] = await mailsTo(world.provider.adminUser.email, raised.body.id);
    expectActionable(mail!);
    expect(mail!.textBody).toContain("Accept or decline the request");
  });

  it("tells the shop what to do after an accept and after a decline", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const first = await world.shop.agent.post("/api/work-orders").send(raiseBody(world));
    const second = await world.shop.agent.post("/api/work-orders").send(raiseBody(world));

    await world.provider.admin.post(`/api/work-orders/${first.body.id}/accept`).send(acceptBody());
    await world.provider.admin
      .post(`/api/work-orders/${second.body.id}/decline`)
      .send({ reason: "No one free" });

    const [accepted] = await mailsTo(world.shop.user.email, first.body.id);
    const [declined] = await mailsTo(world.shop.user.email, second.body.id);
    expectActionable(accepted!);
    expectActionable(declined!);
    expect(accepted!.textBody).toMatch(/lockout\/tagout/);
    expect(declined!.textBody).toContain("Send the same job to another cleared technician");
  });
});

describe("every e-mail", () => {
  it("names the role in an invitation", () => {
    const mail = inviteMail(
      "a@b.test",
      "Ada",
      "Quill Service",
      "https://clearbench.test/set-password?token=x",
      "technician",
    );

    expect(mail.subject).toContain("as a technician");
    expect(mail.text).toContain("as a technician");
    expect(mail.html).toContain('<a href="https://clearbench.test/set-password?token=x">');
  });

  it("refuses a relative link, which would open nothing from a mail client", () => {
    expect(() =>
      composeMail({
        to: "a@b.test",
        subject: "x",
        paragraphs: [],
        next: { sentence: "Go.", label: "Go", url: "/roster" },
      }),
    ).toThrow(/absolute/);
  });
});
