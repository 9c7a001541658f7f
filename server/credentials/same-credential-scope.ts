import { Op } from "sequelize";
import type { Credential } from "./model.ts";

/**
 * The other versions of the same policy or card: same type and holder, and for machine-builder training the same
 * builder and control family, since a technician holds one such card per control. A verified one is superseded by the
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
  if (credential.typeCode === "oem_training") {
    where["fields.builder"] = credential.fields.builder;
    where["fields.controlFamily"] = credential.fields.controlFamily;
  }
  return where;
}
