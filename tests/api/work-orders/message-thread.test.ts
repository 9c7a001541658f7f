import { describe, expect, it } from "vitest";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { countStored } from "../../support/count-uploads.ts";
import { buildWorkOrderWorld, workOrderAt } from "../../fixtures/build-work-order-world.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { WorkOrderMessage } from "../../../server/work-orders/model.ts";
import { Document } from "../../../server/credentials/model.ts";

const t = useTestApp();

async function storedNow() {
  return { ...(await countStored(t.config.UPLOADS_DIR)), messages: await WorkOrderMessage.count() };
}

describe("the message thread of a work order", () => {
  it("lists messages from both sides in order, with author, side and time", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");

    const first = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .send({ body: "Gate code is 4410; ask for Marta." });
    const second = await world.provider.tech
      .post(`/api/work-orders/${id}/messages`)
      .send({ body: "On my way, there by 9." });
    const listed = await world.provider.admin.get(`/api/work-orders/${id}/messages`);

    expect(first.status).toBe(201);
    expect(second.status).toBe(201);
    expect(listed.body.map((m: { side: string; body: string }) => [m.side, m.body])).toEqual([
      ["shop", "Gate code is 4410; ask for Marta."],
      ["service", "On my way, there by 9."],
    ]);
    expect(listed.body[0].author).toEqual({ id: world.shop.user.id, name: world.shop.user.name });
    expect(Date.parse(listed.body[0].createdAt)).not.toBeNaN();
  });

  it("is append-only: the database refuses to change or delete a message", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");
    const posted = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .send({ body: "Original words" });

    const update = () =>
      sequelize().query("UPDATE work_order_messages SET body = 'rewritten' WHERE id = $1", {
        bind: [posted.body.id],
      });
    const remove = () =>
      sequelize().query("DELETE FROM work_order_messages WHERE id = $1", { bind: [posted.body.id] });

    await expect(update()).rejects.toThrow(/append-only/);
    await expect(remove()).rejects.toThrow(/append-only/);
    expect((await WorkOrderMessage.findByPk(posted.body.id))!.body).toBe("Original words");
  });

  it("answers 422 naming the field for an empty message, and leaves no temporary file", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");
    const { bytes } = await buildCertificatePdf({ seed: 21 });
    const before = await storedNow();

    const res = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "  ")
      .attach("file", Buffer.from(bytes), "photo.pdf");

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.body");
    expect(await storedNow()).toEqual(before);
  });
});

describe("attachments on the thread", () => {
  it("stores a PDF as a document of the sender's company, which the other side can download", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "accepted");
    const { bytes } = await buildCertificatePdf({ seed: 22 });
    const before = await storedNow();

    const res = await world.provider.tech
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "Service report attached")
      .attach("file", Buffer.from(bytes), "service-report.pdf");
    const download = await world.shop.agent.get(res.body.attachment.url).buffer(true);

    expect(res.status).toBe(201);
    expect(res.body.attachment).toMatchObject({
      name: "service-report.pdf",
      mime: "application/pdf",
      sizeBytes: bytes.length,
    });
    const document = await Document.findByPk(res.body.attachment.documentId);
    expect(document!.companyId).toBe(world.provider.company.id);
    const after = await storedNow();
    expect(after).toMatchObject({
      documents: before.documents + 1,
      messages: before.messages + 1,
      stored: before.stored + 1,
      incoming: before.incoming,
    });
    expect(download.status).toBe(200);
    expect(download.headers["content-disposition"]).toMatch(/^attachment/);
    expect(Buffer.compare(download.body as Buffer, Buffer.from(bytes))).toBe(0);
  });

  it.each([
    ["an HTML page named .pdf", Buffer.from("<html><script>alert(1)</script></html>"), "notes.pdf"],
    [
      "a PNG named .pdf",
      Buffer.from("89504e470d0a1a0a0000000d4948445200000001000000010806000000", "hex"),
      "photo.pdf",
    ],
  ])("answers 415 to %s and leaves no row and no file", async (_label, bytes, name) => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");
    const before = await storedNow();

    const res = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "See attached")
      .attach("file", bytes, name);

    expect(res.status).toBe(415);
    expect(await storedNow()).toEqual(before);
  });

  it("answers 413 to a file over 10 MB and leaves no row and no file", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");
    const before = await storedNow();

    const res = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "Huge scan")
      .attach(
        "file",
        Buffer.concat([Buffer.from("%PDF-1.7\n"), Buffer.alloc(11 * 1024 * 1024, 32)]),
        "huge.pdf",
      );

    expect(res.status).toBe(413);
    expect(await storedNow()).toEqual(before);
  });

  it("answers 404 to an outsider asking for the attachment", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const other = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");
    const { bytes } = await buildCertificatePdf({ seed: 23 });
    const res = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "Drawing")
      .attach("file", Buffer.from(bytes), "drawing.pdf");

    const download = await other.shop.agent.get(res.body.attachment.url);

    expect(download.status).toBe(404);
  });
});
