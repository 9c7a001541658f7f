import type { TechnicianInput, TechnicianViewDto } from "../../shared/technicians/schemas.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { lookupPostalCode } from "../geo/index.ts";
import { Technician } from "./model.ts";
import { toTechnicianDto } from "./dto.ts";
import { viewLevelOf } from "./visibility.ts";
import { pickTechnicianFields } from "../../shared/visibility/technician-visibility.ts";
import { Company, User } from "../db/models.ts";
import { createInvitedUser } from "../accounts/index.ts";

// Default mileage: IRS business standard mileage rate for 2026, 72.5 cents/mi (Notice 2026-10), rounded up to whole cents.
export const DEFAULT_MILEAGE_RATE_CENTS = 73;

function placeOf(postalCode: string) {
  const place = lookupPostalCode(postalCode);
  if (!place)
    throw new AppError("invalid_input", "Unknown ZIP code", [
      { path: "body.postalCode", message: "not a known US ZIP code" },
    ]);
  return place;
}

async function toDto(t: Technician) {
  const [company, account] = await Promise.all([
    Company.findByPk(t.companyId, { attributes: ["name"] }),
    User.count({ where: { technicianId: t.id } }),
  ]);
  return toTechnicianDto(t, company?.name ?? "", account > 0);
}

export async function listCompanyTechnicians(companyId: number) {
  const [technicians, company, accounts] = await Promise.all([
    Technician.findAll({ where: { companyId }, order: [["name", "ASC"]] }),
    Company.findByPk(companyId, { attributes: ["name"] }),
    User.findAll({ where: { companyId, role: "technician" }, attributes: ["technicianId"] }),
  ]);
  const linked = new Set(accounts.map((a) => a.technicianId));
  return technicians.map((t) => toTechnicianDto(t, company?.name ?? "", linked.has(t.id)));
}

export async function findTechnician(id: number) {
  const t = await Technician.findByPk(id);
  if (!t) throw new AppError("not_found", "That technician was not found");
  return toDto(t);
}

/** The technician as this caller may see them: only the fields of the caller's level by the shared rule. */
export async function findTechnicianFor(user: Express.User, id: number) {
  const level = await viewLevelOf(user, id);
  if (level === "none") throw new AppError("not_found", "That technician was not found");
  // The pick keeps exactly the level's fields, which is what each member of the view schema lists.
  return pickTechnicianFields(await findTechnician(id), level) as TechnicianViewDto;
}

export async function addTechnician(actor: Express.User, input: TechnicianInput) {
  const place = placeOf(input.postalCode);
  const technician = await db().transaction(async (transaction) => {
    const t = await Technician.create(
      {
        companyId: actor.companyId,
        name: input.name,
        email: input.email ?? null,
        phone: input.phone ?? null,
        technologies: input.technologies,
        controlFamilies: input.controlFamilies,
        postalCode: input.postalCode,
        latitude: place.latitude,
        longitude: place.longitude,
        serviceRadiusKm: input.serviceRadiusKm,
        hourlyRateCents: input.hourlyRateCents,
        travelRateCents: input.travelRateCents,
        mileageRateCents: input.mileageRateCents ?? DEFAULT_MILEAGE_RATE_CENTS,
      },
      { transaction },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "technician.added",
        subjectType: "technician",
        subjectId: t.id,
        after: t.toJSON(),
      },
      transaction,
    );
    return t;
  });
  return toDto(technician);
}

export async function editTechnician(actor: Express.User, id: number, input: TechnicianInput) {
  const place = placeOf(input.postalCode);
  const technician = await db().transaction(async (transaction) => {
    const t = await Technician.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!t) throw new AppError("not_found", "That technician was not found");
    const before = t.toJSON();
    await t.update(
      {
        name: input.name,
        email: input.email ?? null,
        phone: input.phone ?? null,
        technologies: input.technologies,
        controlFamilies: input.controlFamilies,
        postalCode: input.postalCode,
        latitude: place.latitude,
        longitude: place.longitude,
        serviceRadiusKm: input.serviceRadiusKm,
        hourlyRateCents: input.hourlyRateCents,
        travelRateCents: input.travelRateCents,
        mileageRateCents: input.mileageRateCents ?? t.mileageRateCents,
      },
      { transaction },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "technician.edited",
        subjectType: "technician",
        subjectId: t.id,
        before,
        after: t.toJSON(),
      },
      transaction,
    );
    return t;
  });
  return toDto(technician);
}

export async function setTechnicianActive(actor: Express.User, id: number, active: boolean) {
  const technician = await db().transaction(async (transaction) => {
    const t = await Technician.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!t) throw new AppError("not_found", "That technician was not found");
    await t.update({ active }, { transaction });
    // A deactivated technician's sign-in stops too.
    await User.update({ active }, { where: { technicianId: id }, transaction });
    await recordAudit(
      {
        actorUserId: actor.id,
        action: active ? "technician.reactivated" : "technician.deactivated",
        subjectType: "technician",
        subjectId: id,
      },
      transaction,
    );
    return t;
  });
  return toDto(technician);
}

/** Gives the technician a sign-in of their own, linked to this record, by an e-mailed one-time link. */
export async function inviteTechnicianAccount(
  actor: Express.User,
  technicianId: number,
  email: string,
  linkBase: string,
) {
  const technician = await findTechnician(technicianId);
  if (technician.hasAccount) throw new AppError("conflict", "This technician already has a sign-in");
  const company = await Company.findByPk(actor.companyId);
  return createInvitedUser(
    actor,
    company!,
    { email, name: technician.name, role: "technician", technicianId: technician.id },
    linkBase,
  );
}
