import type { SubmitCredential } from "../../shared/credentials/schemas.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { Company } from "../companies/model.ts";
import { activeType, toDefinition } from "./catalogue.ts";
import { resolveHolder } from "./resolve-holder.ts";
import { checkNamedTechnicians, lapseInstantFor, parseFields } from "./field-validation.ts";
import { Credential, Document } from "./model.ts";
import { toCredentialDto } from "./dto.ts";

/** Creates a credential awaiting verification from an uploaded document and the checked fields. */
export async function submitCredential(user: Express.User, input: SubmitCredential) {
  const type = await activeType(input.typeCode);
  const technicianId = await resolveHolder(user, type, input.technicianId);
  const document = await Document.findByPk(input.documentId);
  if (!document || document.companyId !== user.companyId) {
    throw new AppError("invalid_input", "Upload the document first", [
      { path: "body.documentId", message: "unknown document" },
    ]);
  }
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
