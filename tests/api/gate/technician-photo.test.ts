import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import request from "supertest";
import { Jimp } from "jimp";
import { useTestApp } from "../../support/test-app.ts";
import { buildClearedProvider } from "../../fixtures/build-credential-row.ts";
import { db } from "../../../server/db/sequelize.ts";
import { signIn } from "../standing/sign-in-as.ts";
import { cameraPhoto } from "../../fixtures/build-camera-photo.ts";

// An EXIF reader independent of the image library that re-encodes the photo.
const ExifParser = createRequire(import.meta.url)("exif-parser") as {
  create(bytes: Buffer): { parse(): { tags: Record<string, unknown> } };
};
const exifTags = (bytes: Buffer) => ExifParser.create(bytes).parse().tags;

const t = useTestApp();

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
