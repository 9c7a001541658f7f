import type { SubmitCredential } from "../../shared/credentials/schemas.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { activeType, toDefinition } from "./catalogue.ts";
import { resolveHolder } from "./resolve-holder.ts";
import { checkNamedTechnicians, lapseInstantFor, parseFields } from "./field-validation.ts";
import { Credential, CredentialType, Document } from "./model.ts";
import { documentAccessFor } from "./document-access.ts";
import { toCredentialDto } from "./dto.ts";
import { Company } from "../db/models.ts";

const documentProblem = (message: string) =>
  new AppError("invalid_input", "That document cannot back this credential", [
    { path: "body.documentId", message },
  ]);

/**
 * The file a credential stands on: one its submitter may already read (anything else answers like a missing file), a
 * credential document rather than a work-order attachment, uploaded as the same kind of document (same field set, so
 * one certificate of insurance may back each coverage it lists) and for the same holder.
 */
async function usableDocument(
  user: Express.User,
  documentId: number,
  type: CredentialType,
  technicianId: number | null,
) {
  const document = await Document.findByPk(documentId);
  if (!document || document.workOrderId !== null || (await documentAccessFor(user, documentId)) !== "read")
    throw documentProblem("unknown document");
  if (document.typeCode !== null) {
    const uploadedAs = await CredentialType.findByPk(document.typeCode, {
      attributes: ["fieldSet", "holder"],
    });
    if (uploadedAs && (uploadedAs.fieldSet !== type.fieldSet || uploadedAs.holder !== type.holder))
      throw documentProblem("uploaded as another kind of document; upload it again as this type");
    if (document.technicianId !== technicianId)
      throw documentProblem("uploaded for another holder; upload it again for this one");
  }
  return document;
}

/** Creates a credential awaiting verification from an uploaded document and the checked fields. */
export async function submitCredential(user: Express.User, input: SubmitCredential) {
  const type = await activeType(input.typeCode);
  const technicianId = await resolveHolder(user, type, input.technicianId);
  const document = await usableDocument(user, input.documentId, type, technicianId ?? null);
  const fields = parseFields(type.fieldSet, input.fields);
  await checkNamedTechnicians(fields, user.companyId);
  const company = await Company.findByPk(user.companyId);
  const lapsesAt = lapseInstantFor(toDefinition(type), fields, company!.timeZone);

  const credential = await db().transaction(async (transaction) => {
    const row = await Credential.create(
      {
        typeCode: type.code,
        companyId: user.companyId,
        technicianId: technicianId ?? null,
        documentId: document.id,
        fields,
        submittedBy: user.id,
        lapsesAt,
      },
      { transaction },
    );
    await recordAudit(
      {
        actorUserId: user.id,
        action: "credential.submitted",
        subjectType: "credential",
        subjectId: row.id,
        after: { state: "submitted", fields },
      },
      transaction,
    );
    return row;
  });
  return toCredentialDto(credential);
}
