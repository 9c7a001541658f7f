import type { Transaction } from "sequelize";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { tellPerson } from "../notices/index.ts";
import { sameCredentialScope } from "./same-credential-scope.ts";
import { refreshStandingsForHolder } from "../standing/index.ts";
import { toDefinition } from "./catalogue.ts";
import { checkNamedTechnicians, lapseInstantFor, parseFields } from "./field-validation.ts";
import { Credential, CredentialType } from "./model.ts";
import { toCredentialDto } from "./dto.ts";
import { tellShopOfVerifiedCertificate } from "./broker-requests.ts";
import { returnedMail, verifiedMail } from "./credential-emails.ts";
import { Company, Technician, User } from "../db/models.ts";

const alreadyDecided = () =>
  new AppError("conflict", "This credential was already decided (by another reviewer, or earlier)");

async function lockSubmitted(id: number, transaction: Transaction) {
  const credential = await Credential.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!credential) throw new AppError("not_found", "That credential was not found");
  // The row lock makes a second reviewer wait here, then see the first one's decision.
  if (credential.state !== "submitted") throw alreadyDecided();
  return credential;
}

async function holderName(credential: Credential, transaction: Transaction) {
  if (credential.technicianId)
    return (await Technician.findByPk(credential.technicianId, { transaction }))?.name ?? "a technician";
  return (await Company.findByPk(credential.companyId, { transaction }))?.name ?? "the company";
}

/** Credentials that a newly verified one replaces: same type and holder (and, for builder training, same control). */
const supersedeScope = (credential: Credential) => sameCredentialScope(credential, ["verified"]);

async function applyFieldEdit(
  reviewer: Express.User,
  credential: Credential,
  fields: Record<string, unknown>,
  transaction: Transaction,
) {
  const type = await CredentialType.findByPk(credential.typeCode, { transaction });
  const company = await Company.findByPk(credential.companyId, { transaction });
  const parsed = parseFields(type!.fieldSet, fields);
  await checkNamedTechnicians(parsed, credential.companyId);
  const before = credential.fields;
  await credential.update(
    { fields: parsed, lapsesAt: lapseInstantFor(toDefinition(type!), parsed, company!.timeZone) },
    { transaction },
  );
  await recordAudit(
    {
      actorUserId: reviewer.id,
      action: "credential.fields_edited",
      subjectType: "credential",
      subjectId: credential.id,
      before,
      after: parsed,
    },
    transaction,
  );
}

export async function editCredentialFields(
  reviewer: Express.User,
  id: number,
  fields: Record<string, unknown>,
) {
  const credential = await db().transaction(async (transaction) => {
    const row = await lockSubmitted(id, transaction);
    await applyFieldEdit(reviewer, row, fields, transaction);
    return row;
  });
  return toCredentialDto(credential);
}

/** Verifies, supersedes the older one of the same kind, mails the uploader and refreshes standings: all or nothing. */
export async function verifyCredential(
  reviewer: Express.User,
  id: number,
  input: { fields?: Record<string, unknown> },
  linkBase: string,
) {
  const credential = await db().transaction(async (transaction) => {
    const row = await lockSubmitted(id, transaction);
    if (input.fields) await applyFieldEdit(reviewer, row, input.fields, transaction);
    await row.update({ state: "verified", decidedBy: reviewer.id, decidedAt: new Date() }, { transaction });
    await recordAudit(
      {
        actorUserId: reviewer.id,
        action: "credential.verified",
        subjectType: "credential",
        subjectId: row.id,
        before: { state: "submitted" },
        after: { state: "verified" },
      },
      transaction,
    );
    const older = await Credential.findAll({
      where: supersedeScope(row),
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    for (const old of older) {
      await old.update({ state: "superseded" }, { transaction });
      await recordAudit(
        {
          actorUserId: reviewer.id,
          action: "credential.superseded",
          subjectType: "credential",
          subjectId: old.id,
          before: { state: "verified" },
          after: { state: "superseded", by: row.id },
        },
        transaction,
      );
    }
    // One connection per transaction: these run one after another.
    const type = await CredentialType.findByPk(row.typeCode, { transaction });
    const uploader = await User.findByPk(row.submittedBy, { transaction });
    const name = await holderName(row, transaction);
    if (uploader)
      await tellPerson(
        verifiedMail(uploader.email, type!.name, name, `${linkBase}/documents`),
        { kind: "credential_verified" },
        transaction,
      );
    await tellShopOfVerifiedCertificate(row, linkBase, transaction);
    await refreshStandingsForHolder(
      { companyId: row.companyId, technicianId: row.technicianId },
      transaction,
    );
    return row;
  });
  return toCredentialDto(credential);
}

export async function returnCredential(reviewer: Express.User, id: number, reason: string, linkBase: string) {
  const credential = await db().transaction(async (transaction) => {
    const row = await lockSubmitted(id, transaction);
    await row.update(
      { state: "returned", returnReason: reason, decidedBy: reviewer.id, decidedAt: new Date() },
      { transaction },
    );
    await recordAudit(
      {
        actorUserId: reviewer.id,
        action: "credential.returned",
        subjectType: "credential",
        subjectId: row.id,
        before: { state: "submitted" },
        after: { state: "returned", reason },
      },
      transaction,
    );
    // One connection per transaction: these run one after another.
    const type = await CredentialType.findByPk(row.typeCode, { transaction });
    const uploader = await User.findByPk(row.submittedBy, { transaction });
    const name = await holderName(row, transaction);
    const link = `${linkBase}/documents/new?type=${row.typeCode}${row.technicianId ? `&technicianId=${row.technicianId}` : ""}`;
    if (uploader)
      await tellPerson(
        returnedMail(uploader.email, type!.name, name, reason, link),
        { kind: "credential_returned" },
        transaction,
      );
    await refreshStandingsForHolder(
      { companyId: row.companyId, technicianId: row.technicianId },
      transaction,
    );
    return row;
  });
  return toCredentialDto(credential);
}
