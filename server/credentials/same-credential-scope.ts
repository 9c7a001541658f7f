import { Op } from "sequelize";
import type { Credential } from "./model.ts";
import { kindFieldsOf } from "../../shared/credentials/credential-kind.ts";

/**
 * The other versions of the same policy or card, as a query: the same kind by `sameCredentialKind`'s rule (type,
 * holder, and the fields `kindFieldsOf` names). A verified one is superseded by the
 * next verified one of this scope, and the reviewer compares against it.
 */
export function sameCredentialScope(credential: Credential, states: readonly string[]) {
  const where: Record<string | symbol, unknown> = {
    id: { [Op.ne]: credential.id },
    typeCode: credential.typeCode,
    companyId: credential.companyId,
    technicianId: credential.technicianId,
    state: states.length === 1 ? states[0] : { [Op.in]: states },
  };
  for (const key of kindFieldsOf(credential.typeCode)) where[`fields.${key}`] = credential.fields[key];
  return where;
}
