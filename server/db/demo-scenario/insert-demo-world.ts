import type { InferCreationAttributes, Transaction } from "sequelize";
import { credentialTypeByCode } from "../../../shared/credentials/catalogue.ts";
import type { CredentialFields } from "../../../shared/credentials/credential-fields.ts";
import { credentialLapseInstant } from "../../../shared/standing/lapse-instant.ts";
import { AuditEvent } from "../../audit/index.ts";
import { lookupPostalCode } from "../../geo/postal-codes.ts";
import type { DemoCredential, DemoWorld } from "./demo-world-types.ts";
import type { StagedFile } from "./stage-demo-files.ts";
import { Company, Credential, Document, Technician, User } from "../models.ts";

type AuditRow = Omit<InferCreationAttributes<AuditEvent>, "id">;

function place(postalCode: string) {
  const found = lookupPostalCode(postalCode);
  return { latitude: found?.latitude ?? null, longitude: found?.longitude ?? null };
}

/** The audit trail a real upload and review would have left, dated when each step happened. */
function auditTrailFor(
  demo: DemoCredential,
  ids: { credential: number; document: number; uploader: number; reviewer: number; supersededBy?: number },
): AuditRow[] {
  const rows: AuditRow[] = [
    {
      actorUserId: ids.uploader,
      action: "document.uploaded",
      subjectType: "document",
      subjectId: ids.document,
      before: null,
      after: { mime: "application/pdf" },
      createdAt: demo.submittedAt,
    },
    {
      actorUserId: ids.uploader,
      action: "credential.submitted",
      subjectType: "credential",
      subjectId: ids.credential,
      before: null,
      after: { state: "submitted", fields: demo.fields },
      createdAt: demo.submittedAt,
    },
  ];
  if (demo.state === "submitted" || !demo.decidedAt) return rows;
  if (demo.state === "returned") {
    rows.push({
      actorUserId: ids.reviewer,
      action: "credential.returned",
      subjectType: "credential",
      subjectId: ids.credential,
      before: { state: "submitted" },
      after: { state: "returned", reason: demo.returnReason },
      createdAt: demo.decidedAt,
    });
    return rows;
  }
  rows.push({
    actorUserId: ids.reviewer,
    action: "credential.verified",
    subjectType: "credential",
    subjectId: ids.credential,
    before: { state: "submitted" },
    after: { state: "verified" },
    createdAt: demo.decidedAt,
  });
  if (demo.state === "superseded") {
    rows.push({
      actorUserId: ids.reviewer,
      action: "credential.superseded",
      subjectType: "credential",
      subjectId: ids.credential,
      before: { state: "verified" },
      after: { state: "superseded", by: ids.supersededBy ?? null },
      createdAt: demo.decidedAt,
    });
  }
  if (demo.state === "lapsed") {
    // The daily job lapses a credential; no person acts.
    rows.push({
      actorUserId: null,
      action: "credential.lapsed",
      subjectType: "credential",
      subjectId: ids.credential,
      before: { state: "verified" },
      after: { state: "lapsed" },
      createdAt: demo.decidedAt,
    });
  }
  return rows;
}

/** Writes every row of the demo world inside the caller's transaction. */
export async function insertDemoWorld(
  world: DemoWorld,
  files: Map<string, StagedFile>,
  passwordHash: string,
  transaction: Transaction,
): Promise<void> {
  const companies = new Map<string, Company>();
  for (const c of world.companies) {
    const company = await Company.create(
      {
        name: c.name,
        kind: c.kind,
        addressLine: c.addressLine,
        postalCode: c.postalCode,
        timeZone: c.timeZone,
        ...place(c.postalCode),
      },
      { transaction },
    );
    companies.set(c.key, company);
  }
  const companyOf = (key: string) => {
    const company = companies.get(key);
    if (!company) throw new Error(`No demo company ${key}`);
    return company;
  };

  const technicians = await Technician.bulkCreate(
    world.technicians.map(({ key: _key, companyKey, ...t }) => ({
      ...t,
      companyId: companyOf(companyKey).id,
      ...place(t.postalCode),
    })),
    { transaction, returning: true },
  );
  const technicianIds = new Map(world.technicians.map((t, i) => [t.key, technicians[i]!.id]));

  const users = await User.bulkCreate(
    world.companies.flatMap((c) =>
      c.users.map((u) => ({
        companyId: companyOf(c.key).id,
        email: u.email,
        name: u.name,
        role: u.role,
        passwordHash,
        technicianId: u.technicianKey ? (technicianIds.get(u.technicianKey) ?? null) : null,
      })),
    ),
    { transaction, returning: true },
  );
  const userIds = new Map(users.map((u) => [u.email, u.id]));
  const reviewerId = users.find((u) => u.role === "reviewer")?.id;
  if (reviewerId === undefined) throw new Error("The demo world needs a reviewer");

  const staged = (demo: DemoCredential) => {
    const file = files.get(demo.key);
    if (!file) throw new Error(`No staged file for ${demo.key}`);
    return file;
  };
  const uploaderOf = (demo: DemoCredential) => {
    const id = userIds.get(demo.submittedBy);
    if (id === undefined) throw new Error(`No demo user ${demo.submittedBy}`);
    return id;
  };

  const documents = await Document.bulkCreate(
    world.credentials.map((demo) => ({
      companyId: companyOf(demo.companyKey).id,
      uploadedBy: uploaderOf(demo),
      sha256: staged(demo).sha256,
      sizeBytes: staged(demo).sizeBytes,
      mime: "application/pdf",
      originalName: demo.document.fileName,
      extractedText: null,
      extractionMethod: "pdf_text",
      typeCode: demo.typeCode,
      technicianId: demo.technicianKey ? (technicianIds.get(demo.technicianKey) ?? null) : null,
      createdAt: demo.submittedAt,
    })),
    { transaction, returning: true },
  );

  const credentials = await Credential.bulkCreate(
    world.credentials.map((demo, i) => {
      const type = credentialTypeByCode.get(demo.typeCode);
      if (!type) throw new Error(`Unknown credential type ${demo.typeCode}`);
      const company = companyOf(demo.companyKey);
      return {
        typeCode: demo.typeCode,
        companyId: company.id,
        technicianId: demo.technicianKey ? (technicianIds.get(demo.technicianKey) ?? null) : null,
        documentId: documents[i]!.id,
        state: demo.state,
        fields: demo.fields,
        returnReason: demo.returnReason,
        submittedBy: uploaderOf(demo),
        submittedAt: demo.submittedAt,
        decidedBy: demo.decidedAt ? reviewerId : null,
        decidedAt: demo.decidedAt,
        lapsesAt: credentialLapseInstant(type, demo.fields as CredentialFields, company.timeZone),
      };
    }),
    { transaction, returning: true },
  );
  const credentialIds = new Map(world.credentials.map((demo, i) => [demo.key, credentials[i]!.id]));

  await AuditEvent.bulkCreate(
    world.credentials.flatMap((demo, i) =>
      auditTrailFor(demo, {
        credential: credentials[i]!.id,
        document: documents[i]!.id,
        uploader: uploaderOf(demo),
        reviewer: reviewerId,
        ...(demo.supersededBy ? { supersededBy: credentialIds.get(demo.supersededBy) } : {}),
      }),
    ),
    { transaction },
  );
}
