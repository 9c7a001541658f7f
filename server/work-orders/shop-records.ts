import { QueryTypes, type Transaction } from "sequelize";
import { db } from "../db/sequelize.ts";

// Sites, machines and requirement sets belong to other domains; read through plain SQL so no model is shared.
export interface SiteRow {
  id: number;
  company_id: number;
  name: string;
  contact_name: string | null;
  contact_phone: string | null;
  safety_induction_note: string | null;
  default_po_number: string | null;
  default_not_to_exceed_cents: number | null;
}
export interface EquipmentRow {
  id: number;
  site_id: number;
  technology: string;
}
export interface RequirementSetRow {
  id: number;
  company_id: number;
  active: boolean;
}
export interface TechnicianRow {
  id: number;
  company_id: number;
  active: boolean;
  company_kind: string;
}

async function one<T extends object>(
  sql: string,
  id: number,
  transaction?: Transaction,
): Promise<T | undefined> {
  const rows = await db().query<T>(sql, { bind: [id], transaction, type: QueryTypes.SELECT });
  return rows[0];
}

export const findSite = (id: number, t?: Transaction) =>
  one<SiteRow>(
    "SELECT id, company_id, name, contact_name, contact_phone, safety_induction_note, default_po_number, default_not_to_exceed_cents FROM sites WHERE id = $1",
    id,
    t,
  );
export const findEquipment = (id: number, t?: Transaction) =>
  one<EquipmentRow>("SELECT id, site_id, technology FROM equipment WHERE id = $1", id, t);
export const findRequirementSet = (id: number, t?: Transaction) =>
  one<RequirementSetRow>("SELECT id, company_id, active FROM requirement_sets WHERE id = $1", id, t);
export const findTechnicianForWork = (id: number, t?: Transaction) =>
  one<TechnicianRow>(
    "SELECT t.id, t.company_id, t.active, co.kind AS company_kind FROM technicians t JOIN companies co ON co.id = t.company_id WHERE t.id = $1",
    id,
    t,
  );
