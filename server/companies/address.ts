import type { CompanyAddress, CompanyProfileDto } from "../../shared/accounts/schemas.ts";
import { recordAudit } from "../audit/index.ts";
import { db } from "../db/sequelize.ts";
import { lookupPostalCode, type PostalPlace } from "../geo/index.ts";
import { AppError } from "../http/app-error.ts";
import { refreshStandings } from "../standing/refresh-standing.ts";
import { Company } from "./model.ts";
import type { Transaction } from "sequelize";
import { loadCatalogue } from "../credentials/catalogue.ts";
import { lapseInstantFor } from "../credentials/field-validation.ts";
import { Credential } from "../db/models.ts";

/** The place of a company's mailing address, with the zone its policy periods are read in; refused when unknown. */
export function placeOfCompany(
  postalCode: string,
  path = "body.postalCode",
): PostalPlace & { timeZone: string } {
  const place = lookupPostalCode(postalCode);
  if (!place)
    throw new AppError("invalid_input", "Unknown ZIP code", [{ path, message: "not a known US ZIP code" }]);
  const { timeZone } = place;
  if (!timeZone)
    throw new AppError("invalid_input", "No time zone is known for this ZIP code", [
      {
        path,
        message: "no time zone is known for this ZIP code; check it or ask support",
      },
    ]);
  return { ...place, timeZone };
}

/** Every credential's stored lapse instant read again in the company's new zone (policy periods and cards alike). */
async function restampLapses(companyId: number, timeZone: string, transaction: Transaction) {
  const types = await loadCatalogue();
  const rows = await Credential.findAll({ where: { companyId }, transaction });
  for (const row of rows) {
    const type = types.get(row.typeCode);
    if (!type) continue;
    await row.update(
      { lapsesAt: lapseInstantFor(type, row.fields as Record<string, unknown>, timeZone) },
      { transaction },
    );
  }
}

export function toCompanyProfileDto(company: Company): CompanyProfileDto {
  const place = company.postalCode ? lookupPostalCode(company.postalCode) : undefined;
  return {
    id: company.id,
    name: company.name,
    kind: company.kind,
    addressLine: company.addressLine,
    postalCode: company.postalCode,
    city: place?.city ?? null,
    state: place?.state ?? null,
    timeZone: company.timeZone,
  };
}

export async function findOwnCompany(user: Express.User): Promise<CompanyProfileDto> {
  const company = await Company.findByPk(user.companyId);
  if (!company) throw new AppError("not_found", "That company was not found");
  return toCompanyProfileDto(company);
}

/**
 * Moves the company's mailing address; the zone follows the new ZIP code, and the company's standings are recomputed in
 * the same transaction because every policy period of the company is read in that zone.
 */
export async function changeCompanyAddress(
  user: Express.User,
  input: CompanyAddress,
): Promise<CompanyProfileDto> {
  const place = placeOfCompany(input.postalCode);
  return db().transaction(async (transaction) => {
    const company = await Company.findByPk(user.companyId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!company) throw new AppError("not_found", "That company was not found");
    const before = {
      addressLine: company.addressLine,
      postalCode: company.postalCode,
      timeZone: company.timeZone,
    };
    await company.update(
      {
        addressLine: input.addressLine,
        postalCode: place.postalCode,
        timeZone: place.timeZone,
        latitude: place.latitude,
        longitude: place.longitude,
      },
      { transaction },
    );
    await recordAudit(
      {
        actorUserId: user.id,
        action: "company.address_changed",
        subjectType: "company",
        subjectId: company.id,
        before,
        after: {
          addressLine: company.addressLine,
          postalCode: company.postalCode,
          timeZone: company.timeZone,
        },
      },
      transaction,
    );
    if (company.kind === "service" && before.timeZone !== company.timeZone) {
      await restampLapses(company.id, company.timeZone, transaction);
      await refreshStandings({ companyIds: [company.id], technicianIds: [] }, transaction);
    }
    return toCompanyProfileDto(company);
  });
}
