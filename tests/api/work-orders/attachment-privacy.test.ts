import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import { signedInAgent } from "../../support/build-provider.ts";
import { buildWorkOrderWorld, workOrderAt } from "../../fixtures/build-work-order-world.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { submitLiabilityCertificate } from "../../support/submit-credential.ts";
import { AuditEvent } from "../../../server/audit/model.ts";

const t = useTestApp();

async function attachmentWorld(seed: number) {
  const world = await buildWorkOrderWorld(t.app);
  const id = await workOrderAt(world, "accepted");
  const { bytes } = await buildCertificatePdf({ seed });
  const posted = await world.shop.agent
    .post(`/api/work-orders/${id}/messages`)
    .field("body", "Photo of the alarm screen")
    .attach("file", Buffer.from(bytes), "alarm.pdf");
  expect(posted.status).toBe(201);
  return { world, workOrderId: id, documentId: posted.body.attachment.documentId as number };
}

const disputeReads = (workOrderId: number) =>
  AuditEvent.count({
    where: {
      action: "work_order.attachment_read_by_admin",
      subjectType: "work_order",
      subjectId: workOrderId,
    },
  });

describe("work-order attachments belong to the two parties", () => {
  it("lets both parties download an attachment, and no reviewer", async () => {
    const { world, documentId } = await attachmentWorld(51);
    const reviewer = await signedInAgent(t.app, "platform", "reviewer");

    const shop = await world.shop.agent.get(`/api/documents/${documentId}/file`);
    const office = await world.provider.admin.get(`/api/documents/${documentId}/file`);
    const technician = await world.provider.tech.get(`/api/documents/${documentId}/file`);
    const byReviewer = await reviewer.agent.get(`/api/documents/${documentId}/file`);
    const pageByReviewer = await reviewer.agent.get(`/api/documents/${documentId}/pages/1`);

    expect([shop.status, office.status, technician.status]).toEqual([200, 200, 200]);
    expect(byReviewer.status).toBe(404);
    expect(pageByReviewer.status).toBe(404);
  });

  it("lets an admin open one for a dispute, and records that reading on the work order", async () => {
    const { workOrderId, documentId } = await attachmentWorld(52);
    const admin = await signedInAgent(t.app, "platform", "admin");
    const before = await disputeReads(workOrderId);

    const res = await admin.agent.get(`/api/documents/${documentId}/file`);

    expect(res.status).toBe(200);
    expect(await disputeReads(workOrderId)).toBe(before + 1);
    const event = await AuditEvent.findOne({
      where: { action: "work_order.attachment_read_by_admin", subjectId: workOrderId },
    });
    expect(event!.actorUserId).toBe(admin.user.id);
    expect(event!.after).toEqual({ documentId });
  });

  it("keeps reviewers reading credential documents, without a dispute record", async () => {
    const { world } = await attachmentWorld(53);
    const credential = await submitLiabilityCertificate(world.provider.admin, 54);
    const reviewer = await signedInAgent(t.app, "platform", "reviewer");
    const before = await AuditEvent.count({ where: { action: "work_order.attachment_read_by_admin" } });

    const res = await reviewer.agent.get(`/api/documents/${credential.documentId}/file`);

    expect(res.status).toBe(200);
    expect(await AuditEvent.count({ where: { action: "work_order.attachment_read_by_admin" } })).toBe(before);
  });

  it("keeps another shop and another company's office out", async () => {
    const { documentId } = await attachmentWorld(55);
    const other = await buildWorkOrderWorld(t.app);

    const shop = await other.shop.agent.get(`/api/documents/${documentId}/file`);
    const office = await other.provider.admin.get(`/api/documents/${documentId}/file`);

    expect([shop.status, office.status]).toEqual([404, 404]);
  });
});
