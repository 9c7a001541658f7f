import type { SubmitCoverages } from "../../shared/credentials/schemas.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { toDefinition } from "./catalogue.ts";
import { lapseInstantFor, parseFields } from "./field-validation.ts";
import { Credential, CredentialType, Document } from "./model.ts";
import { toCredentialDtos } from "./dto.ts";
import { Company } from "../db/models.ts";

type FieldProblem = { path: string; message: string };

/**
 * Creates one credential awaiting verification for each coverage the uploader confirmed from one certificate of
 * insurance. Every coverage is checked first and all problems are reported together; then all rows are written in
 * one transaction, so a bad coverage leaves nothing saved. A coverage the uploader could not read is simply not sent.
 */
export async function submitCoverages(user: Express.User, input: SubmitCoverages) {
  const document = await Document.findByPk(input.documentId);
  // The file rule of a single credential: the company's own credential document (never a work-order attachment),
  // uploaded as a certificate of insurance rather than as a card.
  const uploadedAs = document?.typeCode
    ? await CredentialType.findByPk(document.typeCode, { attributes: ["fieldSet", "holder"] })
    : null;
  if (!document || document.companyId !== user.companyId || document.workOrderId !== null) {
    throw new AppError("invalid_input", "Upload the document first", [
      { path: "body.documentId", message: "unknown document" },
    ]);
  }
  if (uploadedAs && (uploadedAs.fieldSet !== "insurance" || uploadedAs.holder !== "company")) {
    throw new AppError("invalid_input", "That document cannot back these coverages", [
      {
        path: "body.documentId",
        message: "uploaded as another kind of document; upload it again as a certificate",
      },
    ]);
  }
  const types = await CredentialType.findAll({ where: { code: input.credentials.map((c) => c.typeCode) } });
  const typeOf = new Map(types.map((t) => [t.code, t]));
  const company = await Company.findByPk(user.companyId);
  const problems: FieldProblem[] = [];
  const rows = input.credentials.flatMap((entry, i) => {
    const type = typeOf.get(entry.typeCode);
    if (!type || !type.active) {
      problems.push({ path: `body.credentials.${i}.typeCode`, message: "unknown or retired type" });
      return [];
    }
    // Cards are one credential per card, held by a technician; only a certificate's coverages travel together.
    if (type.fieldSet !== "insurance" || type.holder !== "company") {
      problems.push({ path: `body.credentials.${i}.typeCode`, message: "not a coverage of a certificate" });
      return [];
    }
    try {
      const fields = parseFields("insurance", entry.fields, `body.credentials.${i}.fields`);
      return [{ type, fields, lapsesAt: lapseInstantFor(toDefinition(type), fields, company!.timeZone) }];
    } catch (err) {
      if (!(err instanceof AppError)) throw err;
      problems.push(...(err.fields ?? []));
      return [];
    }
  });
  if (problems.length > 0) {
    throw new AppError("invalid_input", "Some coverages need attention; nothing was sent", problems);
  }

  const created = await db().transaction(async (transaction) => {
    const saved: Credential[] = [];
    for (const row of rows) {
      const credential = await Credential.create(
        {
          typeCode: row.type.code,
          companyId: user.companyId,
          technicianId: null,
          documentId: document.id,
          fields: row.fields,
          submittedBy: user.id,
          lapsesAt: row.lapsesAt,
        },
        { transaction },
      );
      await recordAudit(
        {
          actorUserId: user.id,
          action: "credential.submitted",
          subjectType: "credential",
          subjectId: credential.id,
          after: { state: "submitted", fields: row.fields, documentId: document.id },
        },
        transaction,
      );
      saved.push(credential);
    }
    return saved;
  });
  return { credentials: await toCredentialDtos(created) };
}
