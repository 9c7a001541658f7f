import { QueryTypes } from "sequelize";
import type { RecordShopService } from "../../shared/machines/service-history.ts";
import { calendarDateIn } from "../../shared/dates/local-time.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { Site, type Equipment } from "../db/models.ts";

/**
 * The shop writes down work done outside the platform. It is kept apart from work orders, with names as plain text
 * and no link to a technician, so it shows in the history but can never be rated or counted in a score.
 */
export async function recordShopService(buyer: Express.User, machine: Equipment, input: RecordShopService) {
  const site = await Site.findByPk(machine.siteId, { attributes: ["timeZone"] });
  const today = calendarDateIn(new Date(), site?.timeZone ?? "UTC");
  if (input.performedOn > today) {
    throw new AppError("invalid_input", "The work cannot be dated after today", [
      { path: "body.performedOn", message: "after today at the site" },
    ]);
  }
  return db().transaction(async (transaction) => {
    const [row] = await db().query<{ id: number }>(
      `INSERT INTO machine_shop_records (equipment_id, shop_company_id, performed_on, work_kind, problem_area,
         service_company_name, technician_name, hours_on_site, travel_hours, note, parts_used, recorded_by)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11::jsonb, $12) RETURNING id`,
      {
        bind: [
          machine.id,
          buyer.companyId,
          input.performedOn,
          input.kind,
          input.problemArea ?? null,
          input.serviceCompanyName || null,
          input.technicianName || null,
          input.hoursOnSite ?? null,
          input.travelHours ?? null,
          input.note,
          JSON.stringify(input.partsUsed),
          buyer.id,
        ],
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    await recordAudit(
      {
        actorUserId: buyer.id,
        action: "machine.service_recorded",
        subjectType: "equipment",
        subjectId: machine.id,
        after: { recordId: row!.id, ...input },
      },
      transaction,
    );
    return { key: `rec-${row!.id}` };
  });
}
