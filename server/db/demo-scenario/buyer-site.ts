import { QueryTypes, type Transaction } from "sequelize";
import { requirementSetSchema, type RequirementSet } from "../../../shared/standing/requirements.ts";
import { lookupPostalCode } from "../../geo/postal-codes.ts";
import { db } from "../sequelize.ts";
import { demoBuilders } from "./machine-builders.ts";

/** The demo buyer's plant: the shop's only site, so every page that decides for a site starts from it. */
export const demoBuyerSite = {
  companyName: "Marlow Precision Components",
  name: "Marlow Rockford plant",
  addressLine: "3100 Quarry Bend Road",
  postalCode: "61101",
  timeZone: "America/Chicago",
} as const;

/**
 * What the plant asks of every technician, on top of the platform baseline: insurance with the limits a shop commonly
 * writes into its contractor terms (common practice: $1,000,000 each occurrence), and a current lockout/tagout card,
 * since the work is on energized machines (29 CFR 1910.147(c)(7) requires the training).
 */
export const demoBuyerRequirements: RequirementSet = requirementSetSchema.parse({
  name: "Rockford plant contractor rules",
  requirements: [
    {
      label: "General liability, $1,000,000 each occurrence",
      typeCodes: ["general_liability"],
      minLimits: { eachOccurrence: 1_000_000 },
    },
    {
      label: "Workers' compensation or a state exemption",
      typeCodes: ["workers_comp", "workers_comp_exemption"],
    },
    { label: "Lockout/tagout training", typeCodes: ["lockout_tagout"] },
  ],
});

async function insertOne(sql: string, bind: unknown[], transaction: Transaction): Promise<number> {
  const [row] = await db().query<{ id: number }>(`${sql} RETURNING id`, {
    bind,
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!row) throw new Error("The demo insert returned no row");
  return row.id;
}

/** A site, one lathe at it and the site's requirement set for the demo buyer, before the standings are computed. */
export async function insertDemoBuyerSite(transaction: Transaction): Promise<void> {
  const site = demoBuyerSite;
  const place = lookupPostalCode(site.postalCode);
  if (!place) throw new Error(`No postal code ${site.postalCode}`);
  const [shop] = await db().query<{ id: number }>("SELECT id FROM companies WHERE name = $1", {
    bind: [site.companyName],
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!shop) throw new Error(`No demo company ${site.companyName}`);
  const siteId = await insertOne(
    `INSERT INTO sites (company_id, name, address_line, postal_code, time_zone, latitude, longitude)
     VALUES ($1, $2, $3, $4, $5, $6, $7)`,
    [shop.id, site.name, site.addressLine, site.postalCode, site.timeZone, place.latitude, place.longitude],
    transaction,
  );
  await insertOne(
    `INSERT INTO equipment (site_id, builder, control_family, technology, model, serial_number)
     VALUES ($1, $2, $3, 'lathe', 'VT-60 turning center', 'VT60-1187')`,
    [siteId, demoBuilders.vantor.name, demoBuilders.vantor.controls.lathe],
    transaction,
  );
  await insertOne(
    "INSERT INTO requirement_sets (company_id, site_id, name, requirements) VALUES ($1, $2, $3, $4)",
    [shop.id, siteId, demoBuyerRequirements.name, JSON.stringify(demoBuyerRequirements.requirements)],
    transaction,
  );
}
