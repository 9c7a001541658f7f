import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createHash, randomUUID } from "node:crypto";
import { mkdtempSync, readdirSync, utimesSync, writeFileSync, existsSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { buildCompany } from "../support/build-company.ts";
import { connectDatabase } from "../../server/db/sequelize.ts";
import { initModels } from "../../server/db/associations.ts";
import { migrate } from "../../server/db/migrate.ts";
import { createStorage } from "../../server/storage/index.ts";
import { sweepOrphans } from "../../server/storage/sweep-orphans.ts";
import { Document } from "../../server/credentials/model.ts";
import { createTestDatabase } from "../support/test-database.ts";

// A database of its own: the sweep looks at every document row, and other tests' files live elsewhere.
let close: () => Promise<void>;
beforeAll(async () => {
  const sequelize = connectDatabase((await createTestDatabase("sweep")).url);
  initModels(sequelize);
  await migrate(sequelize);
  close = () => sequelize.close();
});
afterAll(() => close());

const sha = (text: string) => createHash("sha256").update(text).digest("hex");

async function documentRow(companyId: number, userId: number, content: string) {
  return Document.create({
    companyId,
    uploadedBy: userId,
    sha256: sha(content),
    sizeBytes: content.length,
    mime: "application/pdf",
    originalName: "x.pdf",
    extractedText: null,
    extractionMethod: "pdf_text",
  });
}

describe("start-up sweep after a crash", () => {
  it("finishes an interrupted move, drops a row whose file never arrived, and removes unowned files", async () => {
    const storage = createStorage(mkdtempSync(path.join(tmpdir(), "clearbench-sweep-")));
    const { company, users } = await buildCompany("service", ["provider_admin"]);
    const user = users.provider_admin!;
    const interrupted = `interrupted ${randomUUID()}`;
    const lost = `lost ${randomUUID()}`;
    const orphan = `orphan ${randomUUID()}`;
    const interruptedRow = await documentRow(company.id, user.id, interrupted);
    const lostRow = await documentRow(company.id, user.id, lost);
    writeFileSync(path.join(storage.incomingDir, `${sha(interrupted)}.${randomUUID()}.ready`), interrupted);
    const orphanTemp = path.join(storage.incomingDir, "orphan.part");
    writeFileSync(orphanTemp, orphan);
    await storage.commit(orphanTemp, sha(orphan));
    const abandoned = path.join(storage.incomingDir, `${randomUUID()}.part`);
    writeFileSync(abandoned, "half an upload");
    const anHourAgo = new Date(Date.now() - 3_600_000);
    utimesSync(abandoned, anHourAgo, anHourAgo);

    const report = await sweepOrphans(storage);

    expect(report.finishedMoves).toBeGreaterThanOrEqual(1);
    expect(await storage.exists(sha(interrupted))).toBe(true);
    expect(await Document.findByPk(interruptedRow.id)).not.toBeNull();
    expect(await Document.findByPk(lostRow.id)).toBeNull();
    expect(await storage.exists(sha(orphan))).toBe(false);
    expect(existsSync(abandoned)).toBe(false);
    expect(readdirSync(storage.incomingDir)).toEqual([]);
  });
});
