import { z } from "zod";
import { QueryTypes } from "sequelize";
import { idParam } from "../../shared/credentials/schemas.ts";
import { machineDtoSchema, machineStates } from "../../shared/sites/schemas.ts";
import { machineTechnologies } from "../../shared/technicians/schemas.ts";
import { singleLineText } from "../../shared/api/text.ts";
import { matchKeysFor } from "../../shared/machines/catalog.ts";
import { createRoutes } from "../http/route.ts";
import { requireOwnership, requireRole } from "../http/policy.ts";
import { db } from "../db/sequelize.ts";
import { AppError } from "../http/app-error.ts";
import { toEquipmentDto } from "../sites/dto.ts";
import { listCatalog } from "./catalog-service.ts";
import { Equipment, Site } from "../db/models.ts";

export const machineRoutes = createRoutes("/api/machines");

const listQuerySchema = z.object({
  siteId: idParam.optional(),
  builder: singleLineText().trim().min(1).max(120).optional(),
  technology: z.enum(machineTechnologies).optional(),
  state: z.enum(machineStates).optional(),
});
const machineParamsSchema = z.object({ machineId: idParam });

/** The machine stands at a site of the buyer's shop; anyone else's answers 404 like a missing one. */
export async function ownMachine(companyId: number, machineId: number) {
  const e = await Equipment.findByPk(machineId);
  if (!e) return null;
  const site = await Site.findByPk(e.siteId, { attributes: ["companyId", "name"] });
  return site?.companyId === companyId ? { machine: e, siteName: site.name } : null;
}

export const canOpenMachine = requireOwnership(
  requireRole("buyer"),
  "a machine at a site of the buyer's shop",
  async (user, params) => (await ownMachine(user.companyId, Number(params.machineId))) !== null,
);

// The shop's machines across all its sites; the builder filter takes any catalog name or alias.
machineRoutes.get(
  "",
  { allow: requireRole("buyer"), query: listQuerySchema, response: z.array(machineDtoSchema) },
  async (req, _res, { query }) => {
    const builderKeys =
      query.builder !== undefined ? matchKeysFor(await listCatalog("builder"), query.builder) : null;
    const rows = await db().query<{ id: number; siteName: string }>(
      `SELECT e.id, s.name AS "siteName" FROM equipment e JOIN sites s ON s.id = e.site_id
      WHERE s.company_id = $1
        AND ($2::int IS NULL OR e.site_id = $2)
        AND ($3::text[] IS NULL OR lower(regexp_replace(btrim(e.builder), '\\s+', ' ', 'g')) = ANY($3::text[]))
        AND ($4::varchar IS NULL OR e.technology = $4)
        AND ($5::varchar IS NULL OR e.state = $5)
      ORDER BY s.name, e.builder, e.model, e.id`,
      {
        bind: [
          req.user!.companyId,
          query.siteId ?? null,
          builderKeys,
          query.technology ?? null,
          query.state ?? null,
        ],
        type: QueryTypes.SELECT,
      },
    );
    const machines = await Equipment.findAll({ where: { id: rows.map((r) => r.id) } });
    const byId = new Map(machines.map((m) => [m.id, m]));
    return rows.map((r) => ({ ...toEquipmentDto(byId.get(r.id)!), siteName: r.siteName }));
  },
);

machineRoutes.get(
  "/:machineId",
  { allow: canOpenMachine, params: machineParamsSchema, response: machineDtoSchema },
  async (req, _res, { params }) => {
    const found = await ownMachine(req.user!.companyId, params.machineId);
    if (!found) throw new AppError("not_found", "That machine was not found");
    return { ...toEquipmentDto(found.machine), siteName: found.siteName };
  },
);
