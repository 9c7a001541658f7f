import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { countStored } from "../../support/count-uploads.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { buildWorkOrderWorld, workOrderAt } from "../../fixtures/build-work-order-world.ts";

const t = useTestApp();

describe("a refused upload leaves no file behind", () => {
  const refusals: [string, Record<string, string>, number][] = [
    ["no typeCode", {}, 422],
    ["a malformed typeCode", { typeCode: "General Liability!" }, 422],
    ["an unknown typeCode", { typeCode: "no_such_type" }, 422],
    ["a technician id that is not a number", { typeCode: "arc_flash", technicianId: "abc" }, 422],
    ["a technician id of another company", { typeCode: "arc_flash", technicianId: "999999999" }, 422],
  ];

  it.each(refusals)("refuses %s and keeps no row and no file", async (_label, fields, status) => {
    const { admin } = await buildProvider(t.app);
    const { bytes } = await buildCertificatePdf({ seed: 61 });
    const before = await countStored(t.config.UPLOADS_DIR);

    let req = admin.post("/api/documents");
    for (const [name, value] of Object.entries(fields)) req = req.field(name, value);
    const res = await req.attach("file", Buffer.from(bytes), "coi.pdf");

    expect(res.status).toBeGreaterThanOrEqual(400);
    expect([status, 404]).toContain(res.status);
    expect(await countStored(t.config.UPLOADS_DIR)).toEqual(before);
  });

  it("refuses a work-order message without text, or with a file that is not a PDF, PNG or JPEG, and keeps no file", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");
    const { bytes } = await buildCertificatePdf({ seed: 62 });
    const before = await countStored(t.config.UPLOADS_DIR);

    const noText = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .attach("file", Buffer.from(bytes), "photo.pdf");
    const wrongType = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "Here is the alarm log")
      .attach("file", Buffer.from("<html>not a picture</html>"), "alarm.png");

    expect(noText.status).toBe(422);
    expect(wrongType.status).toBe(415);
    expect(await countStored(t.config.UPLOADS_DIR)).toEqual(before);
  });
});
