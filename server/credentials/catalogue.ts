import { credentialTypeByCode, type CredentialTypeDefinition } from "../../shared/credentials/catalogue.ts";
import type { CredentialTypeDto } from "../../shared/credentials/credential-shapes.ts";
import { AppError } from "../http/app-error.ts";
import { CredentialType } from "./model.ts";
import { recordAudit } from "../audit/index.ts";

export function toDefinition(t: CredentialType): CredentialTypeDefinition {
  return {
    code: t.code,
    name: t.name,
    category: t.category,
    holder: t.holder,
    fieldSet: t.fieldSet,
    validity: t.validity,
    description: t.description,
  };
}

/** The admin-edited catalogue as the shared engine takes it. */
export async function loadCatalogue(): Promise<Map<string, CredentialTypeDefinition>> {
  const rows = await CredentialType.findAll();
  return new Map(rows.map((r) => [r.code, toDefinition(r)]));
}

export async function activeType(code: string, path = "body.typeCode"): Promise<CredentialType> {
  const type = await CredentialType.findByPk(code);
  if (!type || !type.active)
    throw new AppError("invalid_input", "Unknown credential type", [
      { path, message: "unknown or retired type" },
    ]);
  return type;
}

function toCredentialTypeDto(r: CredentialType): CredentialTypeDto {
  // Cautions are not admin-editable: they come from the code's catalog so each caution is written once.
  return { ...toDefinition(r), caution: credentialTypeByCode.get(r.code)?.caution ?? null, active: r.active };
}

export async function listCredentialTypes() {
  const rows = await CredentialType.findAll({
    order: [
      ["category", "ASC"],
      ["name", "ASC"],
    ],
  });
  return rows.map(toCredentialTypeDto);
}

export async function editCredentialType(
  actor: Express.User,
  code: string,
  input: { name?: string; description?: string; active?: boolean; validityMonths?: number },
) {
  const type = await CredentialType.findByPk(code);
  if (!type) throw new AppError("not_found", "That credential type was not found");
  if (input.validityMonths !== undefined && type.validity.kind !== "months_from_issue") {
    throw new AppError("invalid_input", "Only types valid for N months from issue take a number of months", [
      { path: "body.validityMonths", message: "not a months-from-issue type" },
    ]);
  }
  const before = type.toJSON();
  await type.update({
    name: input.name ?? type.name,
    description: input.description ?? type.description,
    active: input.active ?? type.active,
    validity:
      input.validityMonths !== undefined
        ? { kind: "months_from_issue", months: input.validityMonths }
        : type.validity,
  });
  await recordAudit({
    actorUserId: actor.id,
    action: "credential_type.edited",
    subjectType: "credential_type",
    subjectId: 0,
    before,
    after: type.toJSON(),
  });
  return toCredentialTypeDto(type);
}
