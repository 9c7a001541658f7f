import { describe, expect, it } from "vitest";
import { writeFile } from "node:fs/promises";
import path from "node:path";
import { createHash, randomUUID } from "node:crypto";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { countStored } from "../../support/count-uploads.ts";
import { buildSizedPdf } from "../../fixtures/build-sized-pdf.ts";
import { Document } from "../../../server/credentials/model.ts";
import type { FileStorage } from "../../../server/storage/index.ts";
import { MAX_PREVIEW_PIXELS } from "../../../server/credentials/extraction/render-bounds.ts";

const t = useTestApp();

/** Width and height from a PNG's IHDR chunk. */
function pngSize(png: Buffer) {
  return { width: png.readUInt32BE(16), height: png.readUInt32BE(20) };
}

// supertest's parser signature: the response stream and a callback with the whole body.
const binary = ((res: NodeJS.ReadableStream, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on("data", (c: Buffer) => chunks.push(c));
  res.on("end", () => cb(null, Buffer.concat(chunks)));
}) as never;

describe("page sizes and render bounds", () => {
  it("refuses a PDF whose page is 14,400 pt a side with 422 and keeps no row and no file", async () => {
    const { admin } = await buildProvider(t.app);
    const bytes = await buildSizedPdf([
      [612, 792],
      [14_400, 14_400],
    ]);
    const before = await countStored(t.config.UPLOADS_DIR);

    const res = await admin
      .post("/api/documents")
      .field("typeCode", "general_liability")
      .attach("file", bytes, "poster.pdf");

    expect(bytes.length).toBeLessThan(2_000);
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual([{ path: "file", message: "page too large" }]);
    expect(res.body.error.message).toContain("Page 2 is 200 × 200 in");
    expect(await countStored(t.config.UPLOADS_DIR)).toEqual(before);
  });

  it("accepts a large drawing sheet and previews it within the pixel cap", async () => {
    const { admin } = await buildProvider(t.app);
    const bytes = await buildSizedPdf([[3_000, 2_400]]);
    const up = await admin
      .post("/api/documents")
      .field("typeCode", "general_liability")
      .attach("file", bytes, "sheet.pdf");

    const page = await admin.get(`/api/documents/${up.body.document.id}/pages/1`).buffer(true).parse(binary);

    expect(up.status).toBe(201);
    expect(page.status).toBe(200);
    const { width, height } = pngSize(page.body as Buffer);
    expect(width * height).toBeLessThanOrEqual(MAX_PREVIEW_PIXELS);
    // The aspect of the page is kept: 3,000 × 2,400 pt.
    expect(Math.abs(width / height - 1.25)).toBeLessThan(0.01);
  });

  it("renders an absurd page stored before the upload check as a small image instead of gigabytes", async () => {
    const { admin, company } = await buildProvider(t.app);
    const bytes = await buildSizedPdf([[14_400, 14_400]]);
    const storage = t.app.locals.storage as FileStorage;
    const sha256 = createHash("sha256").update(bytes).digest("hex");
    const temp = path.join(storage.incomingDir, `${randomUUID()}.part`);
    await writeFile(temp, bytes);
    await storage.commit(temp, sha256);
    const document = await Document.create({
      companyId: company.id,
      uploadedBy: (await admin.get("/api/auth/me")).body.id,
      sha256,
      sizeBytes: bytes.length,
      mime: "application/pdf",
      originalName: "legacy.pdf",
      extractedText: "",
      extractionMethod: "pdf_text",
    });

    const page = await admin.get(`/api/documents/${document.id}/pages/1`).buffer(true).parse(binary);

    expect(page.status).toBe(200);
    const { width, height } = pngSize(page.body as Buffer);
    expect(width * height).toBeLessThanOrEqual(MAX_PREVIEW_PIXELS);
  });
});

/** A PNG of a few dozen bytes whose header declares `width` × `height` pixels (a decompression bomb's shape). */
function pngDeclaring(width: number, height: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const length = Buffer.alloc(4);
    length.writeUInt32BE(data.length);
    // The CRC is not checked by the type sniffer or the header reader; zeros keep the fixture short.
    return Buffer.concat([length, Buffer.from(type, "latin1"), data, Buffer.alloc(4)]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.writeUInt8(8, 8); // bit depth
  ihdr.writeUInt8(0, 9); // grayscale
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([
    signature,
    chunk("IHDR", ihdr),
    chunk("IDAT", Buffer.alloc(16)),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}

describe("image sizes at upload", () => {
  it("refuses a small PNG that declares 40,000 × 40,000 pixels with 422 and keeps no row and no file", async () => {
    const { tech } = await buildProvider(t.app);
    const bytes = pngDeclaring(40_000, 40_000);
    const before = await countStored(t.config.UPLOADS_DIR);

    const res = await tech
      .post("/api/documents")
      .field("typeCode", "first_aid_cpr")
      .attach("file", bytes, "card.png");

    expect(bytes.length).toBeLessThan(200);
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual([{ path: "file", message: "image too large" }]);
    expect(res.body.error.message).toContain("40000 × 40000 pixels");
    expect(await countStored(t.config.UPLOADS_DIR)).toEqual(before);
  });
});
