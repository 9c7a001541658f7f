import type { Transaction } from "sequelize";
import type { Requirement } from "../../shared/standing/requirements.ts";
import { AppError } from "../http/app-error.ts";
import { loadCredentialTypes } from "./standing-inputs.ts";

/** Every type code a requirement names must exist in the catalogue; the error names the exact field. */
export async function assertKnownTypeCodes(
  requirements: readonly Requirement[],
  transaction: Transaction,
): Promise<void> {
  const types = await loadCredentialTypes(transaction);
  const problems = requirements.flatMap((r, i) =>
    r.typeCodes
      .map((code, j) => ({ code, j }))
      .filter(({ code }) => !types.has(code))
      .map(({ code, j }) => ({
        path: `body.requirements.${i}.typeCodes.${j}`,
        message: `Unknown credential type ${code}`,
      })),
  );
  if (problems.length) throw new AppError("invalid_input", "Some fields need attention", problems);
}
