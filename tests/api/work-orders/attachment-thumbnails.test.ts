import { describe, expect, it } from "vitest";
import { Jimp } from "jimp";
import request from "supertest";
import { QueryTypes } from "sequelize";
import { useTestApp } from "../../support/test-app.ts";
import { buildWorkOrderWorld, workOrderAt } from "../../fixtures/build-work-order-world.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { imageDimensionsFromHeader } from "../../../server/credentials/index.ts";
import {
  makeThumbnail,
  THUMBNAIL_MAX_PX,
  THUMBNAIL_SOURCE_MAX_PIXELS,
} from "../../../server/work-orders/attachment-thumbnail.ts";
import { db } from "../../../server/db/sequelize.ts";

const t = useTestApp();

async function photoPng(width: number, height: number): Promise<Buffer> {
  const image = new Jimp({ width, height, color: 0x3366aaff });
  return image.getBuffer("image/png");
}

async function acceptedWorkOrder() {
  const world = await buildWorkOrderWorld(t.app);
  return { world, id: await workOrderAt(world, "accepted") };
}

describe("image attachments in a work order's thread", () => {
  it("carry a thumbnail no larger than 240 px, sized in the answer, served as a JPEG to both parties", async () => {
    const { world, id } = await acceptedWorkOrder();
    const png = await photoPng(1200, 800);

    const posted = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "The alarm screen")
      .attach("file", png, "alarm-screen.png");
    const listed = await world.provider.tech.get(`/api/work-orders/${id}/messages`);
    const thumbnail = listed.body[0].attachment.thumbnail as { url: string; width: number; height: number };
    const fetched = await world.provider.tech.get(thumbnail.url).buffer(true);

    expect(posted.status).toBe(201);
    expect(posted.body.attachment.sizeBytes).toBe(png.length);
    expect(thumbnail).toMatchObject({ width: THUMBNAIL_MAX_PX, height: 160 });
    expect(fetched.status).toBe(200);
    expect(fetched.headers["content-type"]).toBe("image/jpeg");
    expect(fetched.headers["x-content-type-options"]).toBe("nosniff");
    expect(imageDimensionsFromHeader(fetched.body as Buffer)).toEqual({ width: 240, height: 160 });
  });

  it("keeps a small image at its own size and gives a PDF no thumbnail", async () => {
    const { world, id } = await acceptedWorkOrder();
    const { bytes } = await buildCertificatePdf({ seed: 61 });

    const small = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "Nameplate")
      .attach("file", await photoPng(120, 90), "nameplate.png");
    const pdf = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "The service report")
      .attach("file", Buffer.from(bytes), "report.pdf");

    expect(small.body.attachment.thumbnail).toMatchObject({ width: 120, height: 90 });
    expect(pdf.body.attachment.thumbnail).toBeNull();
  });

  it("answers another company's buyer with 404 for the thumbnail, and 401 when signed out", async () => {
    const { world, id } = await acceptedWorkOrder();
    const stranger = await buildWorkOrderWorld(t.app);
    const posted = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "Spindle nose")
      .attach("file", await photoPng(400, 400), "spindle.png");
    const url = posted.body.attachment.thumbnail.url as string;

    const foreign = await stranger.shop.agent.get(url);
    const foreignOffice = await stranger.provider.admin.get(url);
    const anonymous = await request(t.app).get(url);

    expect(foreign.status).toBe(404);
    expect(foreignOffice.status).toBe(404);
    expect(anonymous.status).toBe(401);
  });

  it("decodes no picture that declares more pixels than the bound, however small its file", async () => {
    const png = await photoPng(16, 16);
    // The header states the size (PNG IHDR, ISO/IEC 15948 §11.2.2): 30,000 × 30,000 declared in a file of a few bytes.
    png.writeUInt32BE(30_000, 16);
    png.writeUInt32BE(30_000, 20);

    expect(30_000 * 30_000).toBeGreaterThan(THUMBNAIL_SOURCE_MAX_PIXELS);
    expect(await makeThumbnail(png, "image/png")).toBeNull();
    expect(await makeThumbnail(await photoPng(64, 48), "image/png")).toMatchObject({ width: 64, height: 48 });
    expect(await makeThumbnail(Buffer.from("%PDF-1.7"), "application/pdf")).toBeNull();
  });

  it("leaves no thumbnail and no document behind when the message is refused", async () => {
    const { world, id } = await acceptedWorkOrder();

    const refused = await world.shop.agent
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "")
      .attach("file", await photoPng(300, 200), "empty-body.png");
    const [left] = await db().query<{ documents: number; thumbnails: number }>(
      `SELECT count(d.id)::int AS documents, count(th.document_id)::int AS thumbnails
         FROM documents d LEFT JOIN attachment_thumbnails th ON th.document_id = d.id
        WHERE d.work_order_id = $1`,
      { bind: [id], type: QueryTypes.SELECT },
    );

    expect(refused.status).toBe(422);
    expect(left).toEqual({ documents: 0, thumbnails: 0 });
  });
});
