import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { buildTestApp, type TestApp } from "../../support/test-app.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { countStored } from "../../support/count-uploads.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { buildDecompressionBomb, buildPdfWithJavaScript } from "../../fixtures/build-hostile-pdfs.ts";

let t: TestApp;
let provider: Awaited<ReturnType<typeof buildProvider>>;
beforeAll(async () => {
  t = buildTestApp();
  provider = await buildProvider(t.app);
});
afterAll(() => t.close());

const upload = (bytes: Buffer, name: string) =>
  provider.admin.post("/api/documents").field("typeCode", "general_liability").attach("file", bytes, name);

describe("hostile uploads", () => {
  it("refuses an SVG renamed to .pdf and leaves nothing behind", async () => {
    const before = await countStored(t.config.UPLOADS_DIR);

    const res = await upload(
      Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
      "coi.pdf",
    );

    expect(res.status).toBe(415);
    expect(await countStored(t.config.UPLOADS_DIR)).toEqual(before);
  });

  it("stores a PDF with embedded JavaScript but only ever serves it as a sandboxed download", async () => {
    const res = await upload(buildPdfWithJavaScript(), "with-script.pdf");

    const file = await provider.admin.get(`/api/documents/${res.body.document.id}/file?inline=1`);

    expect(res.status).toBe(201);
    expect(file.headers["content-disposition"]).toMatch(/^attachment;/);
    expect(file.headers["content-security-policy"]).toContain("sandbox");
    expect(file.headers["x-content-type-options"]).toBe("nosniff");
  });

  it("reads a decompression bomb within a bounded time and without taking the server down", async () => {
    const started = Date.now();

    const res = await upload(buildDecompressionBomb(200), "bomb.pdf");
    const health = await provider.admin.get("/api/health");

    expect(res.status).toBeLessThan(500);
    expect(Date.now() - started).toBeLessThan(25_000);
    expect(health.status).toBe(200);
  }, 40_000);

  it("keeps only the base name of a path-traversal file name", async () => {
    const { bytes } = await buildCertificatePdf({ seed: 61 });

    const res = await upload(Buffer.from(bytes), "../../../etc/passwd.pdf");
    const file = await provider.admin.get(`/api/documents/${res.body.document.id}/file`);

    expect(res.status).toBe(201);
    expect(res.body.document.name).toBe("passwd.pdf");
    expect(file.headers["content-disposition"]).not.toContain("..");
  });

  it("accepts a 300-character Unicode file name, shortened, and echoes it safely", async () => {
    const { bytes } = await buildCertificatePdf({ seed: 62 });
    const long = `${"Zertifikat-ß-ü-証明書-".repeat(15).slice(0, 296)}.pdf`;

    const res = await upload(Buffer.from(bytes), long);
    const file = await provider.admin.get(`/api/documents/${res.body.document.id}/file`);

    expect(res.status).toBe(201);
    expect(Array.from(res.body.document.name as string).length).toBeLessThanOrEqual(120);
    expect(file.headers["content-disposition"]).toContain("filename*=UTF-8''");
  });

  it("handles 30 parallel uploads with one stored copy per distinct file and a row for each", async () => {
    const files = await Promise.all(
      Array.from({ length: 10 }, (_, i) => buildCertificatePdf({ seed: 100 + i })),
    );
    const before = await countStored(t.config.UPLOADS_DIR);

    const results = await Promise.all(
      Array.from({ length: 30 }, (_, i) => upload(Buffer.from(files[i % 10]!.bytes), `parallel-${i}.pdf`)),
    );
    const after = await countStored(t.config.UPLOADS_DIR);

    expect(results.map((r) => r.status)).toEqual(Array(30).fill(201));
    expect(after.documents - before.documents).toBe(30);
    expect(after.stored - before.stored).toBe(10);
    expect(after.incoming).toBe(0);
  }, 60_000);
});
