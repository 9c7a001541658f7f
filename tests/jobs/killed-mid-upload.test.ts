import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync } from "node:fs";
import http from "node:http";
import { tmpdir } from "node:os";
import path from "node:path";
import { randomUUID } from "node:crypto";
import pg from "pg";
import request from "supertest";
import { buildTestApp, type TestApp } from "../support/test-app.ts";
import { TEST_PASSWORD } from "../support/build-company.ts";
import { startServerProcess, stopProcess } from "../support/server-process.ts";
import { createStorage } from "../../server/storage/index.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";
import { buildCertificatePdf } from "../fixtures/build-certificate-pdf.ts";
import { createTestDatabase } from "../support/test-database.ts";

let t: TestApp;
let databaseUrl: string;
beforeAll(async () => {
  t = buildTestApp();
  // A database of its own, so the restarted server's sweep sees only this test's rows and files.
  databaseUrl = (await createTestDatabase("crash")).url;
});
afterAll(() => t.close());

/** Starts a multipart upload and sends only part of the file, then leaves the connection hanging. */
function halfUpload(base: string, cookie: string): Promise<void> {
  return new Promise((resolve) => {
    const boundary = "----clearbench-crash";
    const req = http.request(`${base}/api/documents`, {
      method: "POST",
      headers: {
        "content-type": `multipart/form-data; boundary=${boundary}`,
        cookie,
        [CSRF_HEADER]: CSRF_HEADER_VALUE,
        "content-length": String(6 * 1024 * 1024),
      },
    });
    req.on("error", () => resolve());
    req.write(
      `--${boundary}\r\nContent-Disposition: form-data; name="typeCode"\r\n\r\ngeneral_liability\r\n`,
    );
    req.write(
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.pdf"\r\nContent-Type: application/pdf\r\n\r\n%PDF-1.7\n`,
    );
    req.write(Buffer.alloc(2 * 1024 * 1024, 32), () => setTimeout(resolve, 300));
  });
}

describe("the server killed with SIGKILL in the middle of an upload", () => {
  it("leaves no row without a file and no file without a row after a restart", async () => {
    const uploadsDir = mkdtempSync(path.join(tmpdir(), "clearbench-crash-"));
    const env = {
      DATABASE_URL: databaseUrl,
      UPLOADS_DIR: uploadsDir,
      PORT: "0",
      RUN_SCHEDULE: "false",
      NODE_ENV: "test",
      BCRYPT_COST: "4",
    };
    const first = await startServerProcess(env);
    const admin = new pg.Client({ connectionString: databaseUrl });
    await admin.connect();
    const signUp = await request(first.url)
      .post("/api/auth/sign-up")
      .set(CSRF_HEADER, CSRF_HEADER_VALUE)
      .send({
        kind: "service",
        companyName: "Marrowfield Machine Service LLC",
        addressLine: "9 Crane Way",
        postalCode: "60601",
        name: "Teodora Vance",
        email: `crash-${randomUUID().slice(0, 8)}@example.test`,
        password: TEST_PASSWORD,
      });
    const cookie = ([] as string[])
      .concat(signUp.headers["set-cookie"] ?? [])
      .map((c) => c.split(";")[0])
      .join("; ");
    const { bytes } = await buildCertificatePdf({ seed: 91 });
    const done = await request(first.url)
      .post("/api/documents")
      .set(CSRF_HEADER, CSRF_HEADER_VALUE)
      .set("Cookie", cookie)
      .field("typeCode", "general_liability")
      .attach("file", Buffer.from(bytes), "ok.pdf");

    await halfUpload(first.url, cookie);
    await stopProcess(first.child, "SIGKILL");
    const second = await startServerProcess(env);
    const rows = await admin.query<{ sha256: string }>("SELECT sha256 FROM documents");
    const storage = createStorage(uploadsDir);
    const stored: string[] = [];
    for await (const key of storage.keys()) stored.push(key);
    await stopProcess(second.child);
    await admin.end();

    expect(signUp.status).toBe(201);
    expect(done.status).toBe(201);
    expect(rows.rows.map((r) => r.sha256).sort()).toEqual([...new Set(stored)].sort());
    expect(stored).toHaveLength(1);
  }, 90_000);
});
