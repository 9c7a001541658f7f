import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import { Jimp } from "jimp";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { buildMachineShop } from "../../fixtures/build-machine-shop.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { cameraPhoto } from "../../fixtures/build-camera-photo.ts";
import { countStored } from "../../support/count-uploads.ts";

// An EXIF reader independent of the image library that re-encodes the photo.
const ExifParser = createRequire(import.meta.url)("exif-parser") as {
  create(bytes: Buffer): { parse(): { tags: Record<string, unknown> } };
};

const t = useTestApp();

const photoRows = async (machineId: number) =>
  sequelize().query<{ id: number; jpeg: Buffer }>(
    "SELECT id, jpeg FROM machine_photos WHERE equipment_id = $1",
    {
      bind: [machineId],
      type: QueryTypes.SELECT,
    },
  );
const auditActions = async (machineId: number) =>
  (
    await sequelize().query<{ action: string }>(
      "SELECT action FROM audit_events WHERE subject_type = 'equipment' AND subject_id = $1 ORDER BY id",
      { bind: [machineId], type: QueryTypes.SELECT },
    )
  ).map((r) => r.action);

/** Raw bytes of a binary answer (supertest leaves image/jpeg unparsed unless asked). */
const asBuffer = (res: { body: unknown }) => res.body as Buffer;

describe("machine photos", () => {
  it("shrinks a camera photo to 1600 px, drops its GPS position, lists it and serves it as a JPEG", async () => {
    const shop = await buildMachineShop(t.app);
    const upload = await cameraPhoto(2400, 1800);
    expect(ExifParser.create(upload).parse().tags.GPSLatitudeRef).toBe("N");

    const res = await shop.agent
      .post(`/api/machines/${shop.machineId}/photos`)
      .field("caption", "Nameplate, left side")
      .attach("file", upload, "IMG_0042.jpg");

    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ width: 1600, height: 1200, caption: "Nameplate, left side" });
    const [row] = await photoRows(shop.machineId);
    const stored = Buffer.from(row!.jpeg);
    // No APP1 "Exif" segment at all (ISO/IEC 10918-1 marker 0xFFE1; CIPA DC-008 GPS IFD).
    expect(stored.includes(Buffer.from("Exif\0\0", "latin1"))).toBe(false);
    expect(ExifParser.create(stored).parse().tags.GPSLatitude).toBeUndefined();
    const list = await shop.agent.get(`/api/machines/${shop.machineId}/photos`);
    expect(list.body).toEqual([expect.objectContaining({ id: res.body.id, url: res.body.url })]);
    const served = await shop.agent.get(res.body.url).buffer(true);
    expect(served.status).toBe(200);
    expect(served.headers["content-type"]).toBe("image/jpeg");
    expect(served.headers["x-content-type-options"]).toBe("nosniff");
    const image = await Jimp.read(asBuffer(served));
    expect([image.width, image.height]).toEqual([1600, 1200]);
    expect(await auditActions(shop.machineId)).toContain("machine_photo.added");
  });

  it("takes a PNG by its bytes, whatever its name, and leaves a small photo at its own size", async () => {
    const shop = await buildMachineShop(t.app);
    const png = await new Jimp({ width: 300, height: 200, color: 0x22aa66ff }).getBuffer("image/png");

    const res = await shop.agent
      .post(`/api/machines/${shop.machineId}/photos`)
      .attach("file", png, "photo.jpg");

    expect(res.status).toBe(201);
    expect([res.body.width, res.body.height]).toEqual([300, 200]);
  });

  it("refuses a PDF named .jpg with 415, no file with 422 and a file over 10 MB with 413, keeping no row and no file", async () => {
    const shop = await buildMachineShop(t.app);
    const before = (await countStored(t.config.UPLOADS_DIR)).incoming;
    // A PDF starts with "%PDF-" (ISO 32000-1 §7.5.2), whatever its name says.
    const pdf = Buffer.from("%PDF-1.4\n%fake photo\n");
    // A JPEG's SOI marker and nothing readable after it (ISO/IEC 10918-1 Annex B): sniffed as JPEG, cannot be decoded.
    const broken = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00]);
    const big = Buffer.alloc(10 * 1024 * 1024 + 10, 0xff);

    const wrongType = await shop.agent
      .post(`/api/machines/${shop.machineId}/photos`)
      .attach("file", pdf, "a.jpg");
    const missing = await shop.agent.post(`/api/machines/${shop.machineId}/photos`).field("caption", "none");
    const damaged = await shop.agent
      .post(`/api/machines/${shop.machineId}/photos`)
      .attach("file", broken, "b.jpg");
    const tooLarge = await shop.agent
      .post(`/api/machines/${shop.machineId}/photos`)
      .attach("file", big, "c.jpg");

    expect(wrongType.status).toBe(415);
    expect(wrongType.body.error.fields).toEqual([expect.objectContaining({ path: "file" })]);
    expect(missing.status).toBe(422);
    expect(damaged.status).toBe(422);
    expect(tooLarge.status).toBe(413);
    expect(await photoRows(shop.machineId)).toEqual([]);
    expect((await countStored(t.config.UPLOADS_DIR)).incoming).toBe(before);
    expect(await auditActions(shop.machineId)).not.toContain("machine_photo.added");
  });

  it("deletes a photo, audited, after which it answers 404", async () => {
    const shop = await buildMachineShop(t.app);
    const added = await shop.agent
      .post(`/api/machines/${shop.machineId}/photos`)
      .attach("file", await cameraPhoto(40, 30), "x.jpg")
      .expect(201);

    const res = await shop.agent.delete(added.body.url);

    expect(res.status).toBe(204);
    expect((await shop.agent.get(added.body.url)).status).toBe(404);
    expect((await shop.agent.get(`/api/machines/${shop.machineId}/photos`)).body).toEqual([]);
    expect(await auditActions(shop.machineId)).toEqual(
      expect.arrayContaining(["machine_photo.added", "machine_photo.deleted"]),
    );
  });

  it("answers another shop exactly like a missing machine and a service company with 403", async () => {
    const owner = await buildMachineShop(t.app);
    const stranger = await buildMachineShop(t.app);
    const provider = await buildProvider(t.app);
    const added = await owner.agent
      .post(`/api/machines/${owner.machineId}/photos`)
      .attach("file", await cameraPhoto(40, 30), "x.jpg")
      .expect(201);

    const list = await stranger.agent.get(`/api/machines/${owner.machineId}/photos`);
    const read = await stranger.agent.get(added.body.url);
    const remove = await stranger.agent.delete(added.body.url);
    const upload = await stranger.agent
      .post(`/api/machines/${owner.machineId}/photos`)
      .attach("file", await cameraPhoto(40, 30), "x.jpg");
    const missing = await stranger.agent.get(`/api/machines/99999999/photos`);
    const byCompany = await provider.admin.get(`/api/machines/${owner.machineId}/photos`);

    expect([list.status, read.status, remove.status, upload.status]).toEqual([404, 404, 404, 404]);
    expect(list.body).toEqual(missing.body);
    expect(byCompany.status).toBe(403);
    expect(await photoRows(owner.machineId)).toHaveLength(1);
  });
});
