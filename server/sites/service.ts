import { fn, col, QueryTypes, type Transaction } from "sequelize";
import type { EquipmentInput, SiteInput } from "../../shared/sites/schemas.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { lookupPostalCode, type PostalPlace } from "../geo/index.ts";
import { Equipment, Site } from "./model.ts";
import { toEquipmentDto, toSiteDto } from "./dto.ts";
import { followStateChange } from "../machines/downtime.ts";

export function placeOfSite(postalCode: string): PostalPlace {
  const place = lookupPostalCode(postalCode);
  if (!place)
    throw new AppError("invalid_input", "Unknown ZIP code", [
      { path: "body.postalCode", message: "not a known US ZIP code" },
    ]);
  return place;
}

/** The offline ZIP lookup behind the site form (no network geocoder). */
export function findPostalPlace(code: string) {
  const place = lookupPostalCode(code);
  if (!place) throw new AppError("not_found", "Unknown ZIP code");
  return {
    postalCode: place.postalCode,
    city: place.city,
    state: place.state,
    latitude: place.latitude,
    longitude: place.longitude,
    timeZone: place.timeZone,
  };
}

function zoneFor(input: SiteInput, place: PostalPlace): string {
  const zone = input.timeZone ?? place.timeZone;
  if (!zone)
    throw new AppError("invalid_input", "Pick the site's time zone", [
      { path: "body.timeZone", message: "no zone is known for this ZIP code" },
    ]);
  return zone;
}

async function equipmentCounts(siteIds: number[]): Promise<Map<number, number>> {
  if (siteIds.length === 0) return new Map();
  const rows = (await Equipment.findAll({
    where: { siteId: siteIds },
    attributes: ["siteId", [fn("count", col("id")), "count"]],
    group: ["siteId"],
    raw: true,
  })) as unknown as { siteId: number; count: number | string }[];
  return new Map(rows.map((r) => [r.siteId, Number(r.count)]));
}

export async function listShopSites(companyId: number, includeArchived: boolean) {
  const where = includeArchived ? { companyId } : { companyId, active: true };
  const sites = await Site.findAll({
    where,
    order: [
      ["name", "ASC"],
      ["id", "ASC"],
    ],
  });
  const counts = await equipmentCounts(sites.map((s) => s.id));
  return sites.map((s) => toSiteDto(s, counts.get(s.id) ?? 0));
}

export async function findSite(siteId: number) {
  const site = await Site.findByPk(siteId);
  if (!site) throw new AppError("not_found", "That site was not found");
  const counts = await equipmentCounts([site.id]);
  return toSiteDto(site, counts.get(site.id) ?? 0);
}

// Left out = unchanged on an edit; an empty value clears it.
const orNull = (v: string | null | undefined) => (v === undefined ? undefined : v || null);
const siteDefaults = (input: SiteInput) =>
  Object.fromEntries(
    Object.entries({
      contactName: orNull(input.contactName),
      contactPhone: orNull(input.contactPhone),
      safetyInductionNote: orNull(input.safetyInductionNote),
      defaultPoNumber: orNull(input.defaultPoNumber),
      defaultNotToExceedCents: input.defaultNotToExceedCents,
    }).filter(([, v]) => v !== undefined),
  );

export async function addSite(actor: Express.User, input: SiteInput) {
  const place = placeOfSite(input.postalCode);
  const site = await db().transaction(async (transaction) => {
    const s = await Site.create(
      {
        companyId: actor.companyId,
        name: input.name,
        addressLine: input.addressLine,
        postalCode: input.postalCode,
        timeZone: zoneFor(input, place),
        latitude: place.latitude,
        longitude: place.longitude,
        ...siteDefaults(input),
      },
      { transaction },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "site.added",
        subjectType: "site",
        subjectId: s.id,
        after: s.toJSON(),
      },
      transaction,
    );
    return s;
  });
  return toSiteDto(site, 0);
}

export async function editSite(actor: Express.User, siteId: number, input: SiteInput) {
  const place = placeOfSite(input.postalCode);
  await db().transaction(async (transaction) => {
    const s = await Site.findByPk(siteId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!s) throw new AppError("not_found", "That site was not found");
    const before = s.toJSON();
    await s.update(
      {
        name: input.name,
        addressLine: input.addressLine,
        postalCode: input.postalCode,
        timeZone: zoneFor(input, place),
        latitude: place.latitude,
        longitude: place.longitude,
        ...siteDefaults(input),
      },
      { transaction },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "site.edited",
        subjectType: "site",
        subjectId: s.id,
        before,
        after: s.toJSON(),
      },
      transaction,
    );
  });
  return findSite(siteId);
}

/** Archives the site: work orders and requirement sets keep pointing at it, so nothing is deleted. */
export async function archiveSite(actor: Express.User, siteId: number) {
  await db().transaction(async (transaction) => {
    const [count] = await Site.update({ active: false }, { where: { id: siteId }, transaction });
    if (count === 0) throw new AppError("not_found", "That site was not found");
    await recordAudit(
      { actorUserId: actor.id, action: "site.archived", subjectType: "site", subjectId: siteId },
      transaction,
    );
  });
}

export async function listSiteEquipment(siteId: number) {
  const rows = await Equipment.findAll({
    where: { siteId },
    order: [
      ["builder", "ASC"],
      ["model", "ASC"],
      ["id", "ASC"],
    ],
  });
  return rows.map(toEquipmentDto);
}

/** The record's columns from the form; a field left out keeps what is stored. */
function machineValues(input: EquipmentInput) {
  const values: Record<string, unknown> = { ...input, serialNumber: input.serialNumber || null };
  for (const k of Object.keys(values)) if (values[k] === undefined) delete values[k];
  return values as Omit<EquipmentInput, "serialNumber"> & { serialNumber: string | null };
}

/**
 * One builder's serial number names one machine on the whole platform. A serial held by another shop is the same
 * machine changing hands, so the answer points at a transfer rather than letting a second record start.
 */
export async function refuseTakenSerial(
  companyId: number,
  builder: string,
  serialNumber: string | null | undefined,
  selfId: number | null,
  transaction: Transaction,
) {
  if (!serialNumber) return;
  const builderKey = builder.trim().replace(/\s+/g, " ").toLowerCase();
  const serialKey = serialNumber.trim().toUpperCase();
  await db().query("SELECT pg_advisory_xact_lock(hashtext($1))", {
    bind: [`machine-serial:${builderKey}:${serialKey}`],
    transaction,
  });
  const [taken] = await db().query<{ id: number; companyId: number }>(
    `SELECT e.id, s.company_id AS "companyId" FROM equipment e JOIN sites s ON s.id = e.site_id
      WHERE lower(regexp_replace(btrim(e.builder), '\\s+', ' ', 'g')) = $1 AND upper(btrim(e.serial_number)) = $2
        AND ($3::int IS NULL OR e.id <> $3) LIMIT 1`,
    { bind: [builderKey, serialKey, selfId], type: QueryTypes.SELECT, transaction },
  );
  if (!taken) return;
  if (taken.companyId === companyId)
    throw new AppError("conflict", "One of your machines already has this builder and serial number", [
      { path: "body.serialNumber", message: "already on your machines" },
    ]);
  throw new AppError(
    "transfer_required",
    "Another shop holds a machine with this builder and serial number: ask that shop to start a transfer to you instead of adding it again",
    [{ path: "body.serialNumber", message: "held by another shop: ask for a transfer" }],
  );
}

export async function addEquipment(actor: Express.User, siteId: number, input: EquipmentInput) {
  const equipment = await db().transaction(async (transaction) => {
    await refuseTakenSerial(actor.companyId, input.builder, input.serialNumber, null, transaction);
    const e = await Equipment.create({ siteId, ...machineValues(input) }, { transaction });
    await followStateChange(e.id, null, e.state, actor.id, new Date(), transaction);
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "equipment.added",
        subjectType: "equipment",
        subjectId: e.id,
        after: e.toJSON(),
      },
      transaction,
    );
    return e;
  });
  return toEquipmentDto(equipment);
}

export async function editEquipment(actor: Express.User, equipmentId: number, input: EquipmentInput) {
  const equipment = await db().transaction(async (transaction) => {
    const e = await Equipment.findByPk(equipmentId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!e) throw new AppError("not_found", "That machine was not found");
    const before = e.toJSON();
    await refuseTakenSerial(actor.companyId, input.builder, input.serialNumber, e.id, transaction);
    await e.update(machineValues(input), { transaction });
    await followStateChange(e.id, before.state ?? null, e.state, actor.id, new Date(), transaction);
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "equipment.edited",
        subjectType: "equipment",
        subjectId: e.id,
        before,
        after: e.toJSON(),
      },
      transaction,
    );
    return e;
  });
  return toEquipmentDto(equipment);
}

/** A machine leaves the site for good (sold, scrapped); the audit trail keeps what it was. */
export async function removeEquipment(actor: Express.User, equipmentId: number) {
  await db().transaction(async (transaction) => {
    const e = await Equipment.findByPk(equipmentId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!e) throw new AppError("not_found", "That machine was not found");
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "equipment.removed",
        subjectType: "equipment",
        subjectId: e.id,
        before: e.toJSON(),
      },
      transaction,
    );
    await e.destroy({ transaction });
  });
}

/** The machine's technology and control family, for the directory's filters; null when it is not at the shop's site. */
export async function findShopEquipment(companyId: number, equipmentId: number) {
  const e = await Equipment.findByPk(equipmentId);
  if (!e) return null;
  const site = await Site.findByPk(e.siteId, { attributes: ["companyId"] });
  return site?.companyId === companyId ? toEquipmentDto(e) : null;
}
