import { describe, expect, it } from "vitest";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { useTestApp } from "../support/test-app.ts";
import { buildProvider } from "../support/build-provider.ts";
import { submitLiabilityCertificate } from "../support/submit-credential.ts";
import { backup, countRows, restore } from "../../server/db/backup.ts";
import { createTestDatabase } from "../support/test-database.ts";

const t = useTestApp();

const freshDatabase = async () => (await createTestDatabase("restore")).url;

describe("backup and restore", () => {
  it("restores into a fresh database and folder with the same row counts and file hashes", async () => {
    const provider = await buildProvider(t.app);
    await submitLiabilityCertificate(provider.admin, 71);
    await submitLiabilityCertificate(provider.admin, 72);
    const folder = mkdtempSync(path.join(tmpdir(), "clearbench-backup-"));
    const target = await freshDatabase();
    const targetUploads = mkdtempSync(path.join(tmpdir(), "clearbench-restored-"));

    const manifest = await backup(t.config.DATABASE_URL!, t.config.UPLOADS_DIR, folder);
    const result = await restore(target, targetUploads, folder);
    const restored = await countRows(target);

    expect(manifest.tables.credentials).toBeGreaterThanOrEqual(2);
    expect(Object.keys(manifest.files).length).toBeGreaterThanOrEqual(2);
    expect(result).toEqual({ ok: true, problems: [] });
    expect(restored.credentials).toBe(manifest.tables.credentials);
    expect(restored.documents).toBe(manifest.tables.documents);
  }, 60_000);
});
