import { describe, expect, it } from "vitest";
import { access, rm, utimes, writeFile } from "node:fs/promises";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { sequelize, useTestApp } from "../support/test-app.ts";
import { buildProvider } from "../support/build-provider.ts";
import { buildCertificatePdf } from "../fixtures/build-certificate-pdf.ts";
import { certificateFields } from "../support/submit-credential.ts";
import { runUploadSweep } from "../../jobs/sweep-uploads.ts";
import type { FileStorage } from "../../server/storage/index.ts";
import { Document } from "../../server/credentials/model.ts";
import { DAY, HOUR, rows } from "./job-support.ts";

const t = useTestApp();

const exists = (file: string) =>
  access(file).then(
    () => true,
    () => false,
  );

async function upload(agent: Awaited<ReturnType<typeof buildProvider>>["admin"], seed: number) {
  const { bytes, values } = await buildCertificatePdf({ seed });
  const res = await agent
    .post("/api/documents")
    .field("typeCode", "general_liability")
    .attach("file", Buffer.from(bytes), `coi-${seed}.pdf`)
    .expect(201);
  return { id: res.body.document.id as number, sha256: res.body.document.sha256 as string, values };
}

async function backdate(documentId: number, ms: number) {
  await sequelize().query(
    "UPDATE documents SET created_at = created_at - make_interval(secs => $2) WHERE id = $1",
    {
      bind: [documentId, ms / 1000],
    },
  );
}

describe("the scheduled sweep of abandoned uploads", () => {
  it("removes a day-old unsubmitted document and its file, and a day-old temporary file, but nothing fresh or submitted", async () => {
    const storage = t.app.locals.storage as FileStorage;
    const { admin } = await buildProvider(t.app);
    const abandoned = await upload(admin, 71);
    const fresh = await upload(admin, 72);
    const submitted = await upload(admin, 73);
    await admin
      .post("/api/credentials")
      .send({
        documentId: submitted.id,
        typeCode: "general_liability",
        fields: certificateFields(submitted.values, "general_liability"),
      })
      .expect(201);
    await backdate(abandoned.id, DAY + HOUR);
    await backdate(submitted.id, DAY + HOUR);
    await backdate(fresh.id, DAY - HOUR);
    const oldTemp = path.join(storage.incomingDir, `${randomUUID()}.part`);
    const newTemp = path.join(storage.incomingDir, `${randomUUID()}.part`);
    await writeFile(oldTemp, "left by a refused request");
    await writeFile(newTemp, "an upload in progress");
    const dayAndAHourAgo = new Date(Date.now() - DAY - HOUR);
    await utimes(oldTemp, dayAndAHourAgo, dayAndAHourAgo);

    const report = await runUploadSweep({ asOf: new Date() }, { storage });

    expect(await Document.findByPk(abandoned.id)).toBeNull();
    expect(await storage.exists(abandoned.sha256)).toBe(false);
    expect(await Document.findByPk(fresh.id)).not.toBeNull();
    expect(await storage.exists(fresh.sha256)).toBe(true);
    expect(await Document.findByPk(submitted.id)).not.toBeNull();
    expect(await storage.exists(submitted.sha256)).toBe(true);
    expect(await exists(oldTemp)).toBe(false);
    expect(await exists(newTemp)).toBe(true);
    // Later test files count the incoming folder: take away the stand-in for an upload in progress.
    await rm(newTemp);
    expect(report.removedDocuments).toBeGreaterThanOrEqual(1);
    expect(report.removedFiles).toBeGreaterThanOrEqual(1);
    expect(report.removedIncoming).toBeGreaterThanOrEqual(1);
    const [run] = await rows<{ counts: Record<string, number> }>(
      "SELECT counts FROM job_runs WHERE job = 'upload_sweep' ORDER BY id DESC LIMIT 1",
    );
    expect(run?.counts).toEqual(report);
  });

  it("keeps the stored file while another document still has the same bytes", async () => {
    const storage = t.app.locals.storage as FileStorage;
    const { admin } = await buildProvider(t.app);
    const first = await upload(admin, 74);
    const second = await upload(admin, 74);
    await backdate(first.id, DAY + HOUR);

    await runUploadSweep({ asOf: new Date() }, { storage });

    expect(await Document.findByPk(first.id)).toBeNull();
    expect(await Document.findByPk(second.id)).not.toBeNull();
    expect(await storage.exists(second.sha256)).toBe(true);
  });
});
