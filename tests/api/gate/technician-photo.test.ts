import { createRequire } from "node:module";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { Jimp } from "jimp";
import { buildTestApp, type TestApp } from "../../support/test-app.ts";
import { buildClearedProvider } from "../../fixtures/build-credential-row.ts";
import { db } from "../../../server/db/sequelize.ts";
import { signIn } from "../standing/sign-in-as.ts";

// An EXIF reader independent of the image library that re-encodes the photo.
const ExifParser = createRequire(import.meta.url)("exif-parser") as {
  create(bytes: Buffer): { parse(): { tags: Record<string, unknown> } };
};
const exifTags = (bytes: Buffer) => ExifParser.create(bytes).parse().tags;

let t: TestApp;
beforeAll(() => {
  t = buildTestApp();
});
afterAll(() => t.close());

/**
 * An APP1 "Exif" segment holding a GPS IFD with a latitude (CIPA DC-008 EXIF 2.3 §4.6.6, tags 0x8825, 0x0001,
 * 0x0002; TIFF 6.0 IFD layout), placed right after the JPEG's SOI marker (ISO/IEC 10918-1 Annex B).
 */
function withGpsExif(jpeg: Buffer): Buffer {
  const tiff = Buffer.alloc(80);
  tiff.write("II", 0, "latin1");
  tiff.writeUInt16LE(42, 2);
  tiff.writeUInt32LE(8, 4);
  tiff.writeUInt16LE(1, 8); // IFD0: one entry, the GPS IFD pointer
  tiff.writeUInt16LE(0x8825, 10);
  tiff.writeUInt16LE(4, 12);
  tiff.writeUInt32LE(1, 14);
  tiff.writeUInt32LE(26, 18);
  tiff.writeUInt32LE(0, 22);
  tiff.writeUInt16LE(2, 26); // GPS IFD: latitude reference and latitude
  tiff.writeUInt16LE(0x0001, 28);
  tiff.writeUInt16LE(2, 30);
  tiff.writeUInt32LE(2, 32);
  tiff.write("N\0", 36, "latin1");
  tiff.writeUInt16LE(0x0002, 40);
  tiff.writeUInt16LE(5, 42);
  tiff.writeUInt32LE(3, 44);
  tiff.writeUInt32LE(56, 48);
  tiff.writeUInt32LE(0, 52);
  [41, 52, 30].forEach((v, i) => {
    tiff.writeUInt32LE(v, 56 + i * 8);
    tiff.writeUInt32LE(1, 60 + i * 8);
  });
  const payload = Buffer.concat([Buffer.from("Exif\0\0", "latin1"), tiff]);
  const header = Buffer.from([0xff, 0xe1, 0, 0]);
  header.writeUInt16BE(payload.length + 2, 2);
  return Buffer.concat([jpeg.subarray(0, 2), header, payload, jpeg.subarray(2)]);
}

async function cameraPhoto(width: number, height: number): Promise<Buffer> {
  const image = new Jimp({ width, height, color: 0x3366aaff });
  return withGpsExif(await image.getBuffer("image/jpeg"));
}

const photoBytes = async (technicianId: number) => {
  const [row] = (await db().query("SELECT jpeg FROM technician_photos WHERE technician_id = $1", {
    bind: [technicianId],
    plain: false,
    raw: true,
  })) as unknown as [{ jpeg: Buffer }[]];
  return row[0] ? Buffer.from(row[0].jpeg) : null;
};

describe("technician photo", () => {
  it("drops the GPS position and shrinks the photo to 512 px, then shows it on the badge and the gate check", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const upload = await cameraPhoto(1600, 1200);
    expect(exifTags(upload).GPSLatitudeRef).toBe("N");

    const tech = await signIn(t.app, p.technicianUser.email);
    const res = await tech.post("/api/badge/photo").attach("file", upload, "me.jpg");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ width: 512, height: 384 });

    const stored = (await photoBytes(p.technician.id))!;
    const tags = exifTags(stored);
    expect(tags.GPSLatitudeRef).toBeUndefined();
    expect(tags.GPSLatitude).toBeUndefined();
    // No APP1 segment at all: the encoder wrote pixels only (ISO/IEC 10918-1 marker 0xFFE1).
    expect(stored.includes(Buffer.from("Exif\0\0", "latin1"))).toBe(false);
    const image = await Jimp.read(stored);
    expect([image.width, image.height]).toEqual([512, 384]);

    const badge = await tech.get("/api/badge");
    expect(badge.body.photo).toBe(`data:image/jpeg;base64,${stored.toString("base64")}`);
    const u = new URL(badge.body.url);
    const check = await request(t.app).get(`/api${u.pathname}${u.search}`);
    expect(check.body.technician.photo).toBe(badge.body.photo);
  });

  it("refuses a file that is not an image by its bytes, whatever its name, and keeps nothing", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const tech = await signIn(t.app, p.technicianUser.email);
    const res = await tech
      .post("/api/badge/photo")
      .attach("file", Buffer.from("%PDF-1.4\n%fake\n"), "me.jpg");
    expect(res.status).toBe(415);
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: "file" })]);

    const missing = await tech.post("/api/badge/photo");
    expect(missing.status).toBe(422);
    expect(await photoBytes(p.technician.id)).toBeNull();
  });

  it("is the technician's own to set: an office admin gets 403", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const admin = await signIn(t.app, p.admin.email);
    const res = await admin.post("/api/badge/photo").attach("file", await cameraPhoto(10, 10), "me.jpg");
    expect(res.status).toBe(403);
  });
});
