import { credentialTypeByCode } from "../credentials/catalogue.ts";

/**
 * Whether only the company can meet a requirement line: every document type it accepts is held by the company
 * (its insurance policies, a state exemption). A technician shown such a line cannot fix it themselves; the office
 * renews it. Unknown codes count as not the company's, so the line never wrongly sends a person away.
 */
export function onlyCompanyCanRenew(typeCodes: readonly unknown[] | undefined): boolean {
  if (!typeCodes || typeCodes.length === 0) return false;
  return typeCodes.every(
    (code) => typeof code === "string" && credentialTypeByCode.get(code)?.holder === "company",
  );
}
