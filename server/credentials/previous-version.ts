import { Op } from "sequelize";
import { compareCredentialFields } from "../../shared/credentials/compare-versions.ts";
import type { PreviousVersionDto } from "../../shared/credentials/credential-shapes.ts";
import { Credential } from "./model.ts";
import { sameCredentialScope } from "./same-credential-scope.ts";

/**
 * The version the reviewer measures this one against: the latest verified version of the same policy or card submitted
 * before it, whether still in force, since replaced or since lapsed (a renewal often arrives after the lapse). A first
 * upload has none.
 */
export async function previousVerifiedVersion(row: Credential): Promise<PreviousVersionDto | null> {
  const previous = await Credential.findOne({
    where: {
      ...sameCredentialScope(row, ["verified", "superseded", "lapsed"]),
      submittedAt: { [Op.lte]: row.submittedAt },
    },
    order: [
      ["decidedAt", "DESC NULLS LAST"],
      ["id", "DESC"],
    ],
  });
  if (!previous) return null;
  return {
    id: previous.id,
    state: previous.state as PreviousVersionDto["state"],
    decidedAt: previous.decidedAt?.toISOString() ?? null,
    changes: compareCredentialFields(previous.fields, row.fields),
  };
}
