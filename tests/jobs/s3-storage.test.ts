import { createHash } from "node:crypto";
import { existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { text } from "node:stream/consumers";
import { S3Client, type ListObjectsV2Command } from "@aws-sdk/client-s3";
import S3rver from "s3rver";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { createS3Storage } from "../../server/storage/s3-storage.ts";
import type { FileStorage } from "../../server/storage/index.ts";
import { Document } from "../../server/credentials/model.ts";
import { buildCertificatePdf } from "../../server/db/demo-scenario/documents/build-certificate-pdf.ts";
import { buildTestApp, sequelize, type TestApp } from "../support/test-app.ts";
import { buildProvider } from "../support/build-provider.ts";

// A local S3-compatible server (s3rver) on loopback, with the default credentials it accepts.
const BUCKET = "clearbench-test";
const CREDENTIALS = { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" };
let s3: S3rver;
let endpoint: string;
let root: string;
let t: TestApp;

const sha256 = (body: string) => createHash("sha256").update(body).digest("hex");

function storageIn(dir: string): FileStorage {
  return createS3Storage({
    endpoint,
    bucket: BUCKET,
    region: "us-east-1",
    ...CREDENTIALS,
    forcePathStyle: true,
    incomingDir: path.join(dir, "incoming"),
  });
}

function incomingFile(storage: FileStorage, body: string): string {
  const file = path.join(storage.incomingDir, `${sha256(body)}.ready`);
  writeFileSync(file, body);
  return file;
}

async function allKeys(storage: FileStorage): Promise<string[]> {
  const keys: string[] = [];
  for await (const key of storage.keys()) keys.push(key);
  return keys;
}

async function emptyBucket(storage: FileStorage) {
  for (const key of await allKeys(storage)) await storage.remove(key);
}

beforeAll(async () => {
  root = mkdtempSync(path.join(tmpdir(), "clearbench-s3-"));
  s3 = new S3rver({
    address: "127.0.0.1",
    port: 0,
    silent: true,
    directory: path.join(root, "s3"),
    configureBuckets: [{ name: BUCKET, configs: [] }],
  });
  const { address, port } = await s3.run();
  endpoint = `http://${address}:${port}`;
  t = buildTestApp();
});

afterAll(async () => {
  await t.close();
  await s3.close();
  rmSync(root, { recursive: true, force: true });
});

describe("S3 storage driver", () => {
  let storage: FileStorage;
  beforeAll(() => {
    storage = storageIn(mkdtempSync(path.join(root, "driver-")));
    mkdirSync(storage.incomingDir, { recursive: true });
  });
  afterEach(() => emptyBucket(storage));

  it("commits an incoming file as an object that can be opened, listed and removed", async () => {
    const body = "certificate bytes";
    const key = sha256(body);
    const temp = incomingFile(storage, body);

    await storage.commit(temp, key);

    expect(await storage.exists(key)).toBe(true);
    expect(await text(await storage.open(key))).toBe(body);
    expect(await allKeys(storage)).toEqual([key]);
    expect(existsSync(temp)).toBe(false);
    await storage.remove(key);
    expect(await storage.exists(key)).toBe(false);
    expect(await allKeys(storage)).toEqual([]);
  });

  it("keeps the first copy when the same content is committed twice and drops the second temporary file", async () => {
    const body = "same bytes twice";
    const key = sha256(body);
    await storage.commit(incomingFile(storage, body), key);
    const second = incomingFile(storage, body);

    await storage.commit(second, key);

    expect(existsSync(second)).toBe(false);
    expect(await allKeys(storage)).toEqual([key]);
    expect(await text(await storage.open(key))).toBe(body);
  });

  it("refuses a key that is not a SHA-256, so no caller can name another object", async () => {
    const temp = incomingFile(storage, "x");

    await expect(storage.commit(temp, "../../etc/passwd")).rejects.toThrow("Invalid storage key");
    await expect(storage.exists("store/abc")).rejects.toThrow("Invalid storage key");
  });

  it("lists only its own keys, following the continuation token from page to page", async () => {
    // s3rver cannot page on Node 20 (its continuation token uses a cipher OpenSSL 3 no longer offers), so the second
    // page is answered here: ListObjectsV2 returns at most 1,000 keys per page (S3 API reference, ListObjectsV2).
    const first = sha256("first page");
    const second = sha256("second page");
    const asked: (string | undefined)[] = [];
    vi.spyOn(S3Client.prototype, "send").mockImplementation(async (command: unknown) => {
      const input = (command as ListObjectsV2Command).input;
      asked.push(input.ContinuationToken);
      return input.ContinuationToken
        ? { Contents: [{ Key: `store/${second}` }], IsTruncated: false }
        : {
            Contents: [{ Key: `store/${first}` }, { Key: "store/not-a-hash.txt" }],
            IsTruncated: true,
            NextContinuationToken: "page-2",
          };
    });

    const keys = await allKeys(storage);
    vi.restoreAllMocks();

    expect(keys).toEqual([first, second]);
    expect(asked).toEqual([undefined, "page-2"]);
  });
});

describe("uploading through the API with the S3 driver", () => {
  let storage: FileStorage;
  beforeAll(() => {
    storage = storageIn(mkdtempSync(path.join(root, "api-")));
    (t.app.locals as { storage: FileStorage }).storage = storage;
    // multer is built on the first upload from the storage's incoming folder; start from a fresh one.
    (t.app.locals as { uploader?: unknown }).uploader = undefined;
    mkdirSync(storage.incomingDir, { recursive: true });
  });
  afterEach(async () => {
    vi.restoreAllMocks();
    await emptyBucket(storage);
  });

  it("stores the uploaded certificate as an object named by its hash", async () => {
    const { admin } = await buildProvider(t.app);
    const { bytes } = await buildCertificatePdf({ seed: 4101 });

    const res = await admin
      .post("/api/documents")
      .field("typeCode", "general_liability")
      .attach("file", Buffer.from(bytes), "certificate.pdf");

    expect(res.status).toBe(201);
    expect(await storage.exists(res.body.document.sha256)).toBe(true);
    expect(readdirSync(storage.incomingDir)).toEqual([]);
  });

  it("leaves no object, no row and no incoming file when the database insert fails", async () => {
    const { admin, company } = await buildProvider(t.app);
    const { bytes } = await buildCertificatePdf({ seed: 4102 });
    vi.spyOn(Document, "create").mockRejectedValueOnce(new Error("simulated database failure"));

    const res = await admin
      .post("/api/documents")
      .field("typeCode", "general_liability")
      .attach("file", Buffer.from(bytes), "certificate.pdf");

    expect(res.status).toBe(500);
    expect(await allKeys(storage)).toEqual([]);
    const [row] = await sequelize().query<{ n: number }>(
      "SELECT count(*)::int AS n FROM documents WHERE company_id = $1",
      { bind: [company.id], type: "SELECT" as never },
    );
    expect(row?.n).toBe(0);
    expect(readdirSync(storage.incomingDir)).toEqual([]);
  });
});
