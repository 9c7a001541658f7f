import type { Transaction } from "sequelize";
import type {
  RaiseServiceRequest,
  RoutedCompanyDto,
  RoutingPreviewDto,
} from "../../shared/service-requests/schemas.ts";
import { machineStateLabels, requestKindLabels } from "../../shared/service-requests/schemas.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { lookupPostalCode } from "../geo/index.ts";
import { companiesWithClearedTechnician, rosterCompanyIds, routeRequest } from "./routing.ts";
import { tellCompany } from "./notify.ts";
import { requestLink } from "./records.ts";
import { insertReturningId, run, selectOne } from "./sql.ts";
import { markDownBy } from "../machines/downtime.ts";

const unknown = (path: string, message: string) =>
  new AppError("invalid_input", message, [{ path, message: "unknown or not yours" }]);

interface SiteRow {
  id: number;
  company_id: number;
  name: string;
  postal_code: string;
  latitude: number;
  longitude: number;
  time_zone: string;
  active: boolean;
}

/** The shop's own site, machine and set; the technology, builder and control family settled from the machine. */
export async function resolveRequestTargets(buyer: Express.User, input: RaiseServiceRequest) {
  const [site, equipment, set] = await Promise.all([
    selectOne<SiteRow>("SELECT * FROM sites WHERE id = $1", [input.siteId]),
    input.equipmentId
      ? selectOne<{
          id: number;
          site_id: number;
          technology: string;
          builder: string;
          control_family: string;
        }>("SELECT id, site_id, technology, builder, control_family FROM equipment WHERE id = $1", [
          input.equipmentId,
        ])
      : undefined,
    input.requirementSetId
      ? selectOne<{ id: number; company_id: number; active: boolean }>(
          "SELECT id, company_id, active FROM requirement_sets WHERE id = $1",
          [input.requirementSetId],
        )
      : undefined,
  ]);
  if (!site || site.company_id !== buyer.companyId || !site.active)
    throw unknown("body.siteId", "Choose one of your shop's sites");
  if (input.equipmentId && (!equipment || equipment.site_id !== site.id))
    throw unknown("body.equipmentId", "Choose a machine at that site");
  if (input.requirementSetId && (!set || set.company_id !== buyer.companyId || !set.active))
    throw unknown("body.requirementSetId", "Choose one of your shop's requirement sets");
  const technology = input.technology ?? equipment?.technology;
  if (!technology) {
    throw new AppError("invalid_input", "Say which machine technology the work is on", [
      { path: "body.technology", message: "required without a machine" },
    ]);
  }
  return {
    site,
    equipment: equipment ?? null,
    requirementSetId: input.requirementSetId ?? null,
    technology,
    builder: equipment?.builder ?? null,
    controlFamily: equipment?.control_family ?? null,
  };
}

type Targets = Awaited<ReturnType<typeof resolveRequestTargets>>;

/**
 * The invited set: the routed companies, minus those the buyer removed, plus roster companies the buyer added that
 * have a technician cleared now for the set. Added companies that fail either test are listed as refused.
 */
export async function planInvitations(
  buyer: Express.User,
  input: RaiseServiceRequest,
  targets: Targets,
  asOf: Date,
  transaction?: Transaction,
): Promise<RoutingPreviewDto> {
  const routed = await routeRequest(
    {
      asOf,
      site: targets.site,
      technology: targets.technology,
      requirementSetId: targets.requirementSetId,
      builder: targets.builder,
      controlFamily: targets.controlFamily,
    },
    transaction,
  );
  const removed = new Set(input.removeCompanyIds);
  const companies: RoutedCompanyDto[] = routed.filter((c) => !removed.has(c.companyId));
  const present = new Set(routed.map((c) => c.companyId));
  const wanted = [...new Set(input.addCompanyIds)].filter((id) => !present.has(id) && !removed.has(id));
  const refused: RoutingPreviewDto["refused"] = [];
  if (wanted.length) {
    const roster = await rosterCompanyIds(buyer.companyId, transaction);
    const onRoster = wanted.filter((id) => roster.has(id));
    for (const id of wanted)
      if (!roster.has(id)) refused.push({ companyId: id, reason: "not on your roster" });
    const cleared = await companiesWithClearedTechnician(
      onRoster,
      asOf,
      targets.requirementSetId,
      transaction,
    );
    const clearedIds = new Set(cleared.map((c) => c.companyId));
    for (const id of onRoster)
      if (!clearedIds.has(id))
        refused.push({ companyId: id, reason: "no technician cleared for this requirement set today" });
    companies.push(...cleared);
  }
  return { count: companies.length, companies, refused };
}

export async function previewServiceRequest(
  buyer: Express.User,
  input: RaiseServiceRequest,
  asOf = new Date(),
) {
  const targets = await resolveRequestTargets(buyer, input);
  return planInvitations(buyer, input, targets, asOf);
}

/** Site area for companies: city, state and ZIP, never the street before the request is decided in their favor. */
export function siteArea(postalCode: string) {
  const place = lookupPostalCode(postalCode);
  return { city: place?.city ?? "", state: place?.state ?? "", postalCode };
}

/**
 * Raises the request and invites every company of the plan in one transaction; refused additions are a 422. `alongside`
 * writes the caller's own rows (a maintenance plan's link) in that same transaction, so neither exists without the other.
 */
export async function raiseServiceRequest(
  buyer: Express.User,
  input: RaiseServiceRequest,
  linkBase: string,
  alongside?: (requestId: number, transaction: Transaction) => Promise<void>,
) {
  const targets = await resolveRequestTargets(buyer, input);
  return db().transaction(async (transaction) => {
    const asOf = new Date();
    const plan = await planInvitations(buyer, input, targets, asOf, transaction);
    if (plan.refused.length) {
      throw new AppError(
        "invalid_input",
        "Some companies you added cannot be invited",
        plan.refused.map((r) => ({
          path: "body.addCompanyIds",
          message: `company ${r.companyId}: ${r.reason}`,
        })),
      );
    }
    if (plan.count === 0) {
      throw new AppError("invalid_input", "No company can be invited to this request", [
        {
          path: "body.siteId",
          message: "no cleared company serves this machine at this site; add one from your roster",
        },
      ]);
    }
    const id = await insertReturningId(
      `INSERT INTO service_requests (shop_company_id, site_id, equipment_id, requirement_set_id, kind, machine_state, timing,
         window_start, window_end, technology, builder, control_family, problem, created_by, sent_at)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13, $14, $15)`,
      [
        buyer.companyId,
        targets.site.id,
        targets.equipment?.id ?? null,
        targets.requirementSetId,
        input.kind,
        input.machineState,
        input.timing,
        input.timing === "window" ? input.windowStart : null,
        input.timing === "window" ? input.windowEnd : null,
        targets.technology,
        targets.builder,
        targets.controlFamily,
        input.problem,
        buyer.id,
        asOf,
      ],
      transaction,
    );
    if (input.machineState === "down" && targets.equipment)
      await markDownBy(
        targets.equipment.id,
        { by: "service_request", userId: buyer.id, serviceRequestId: id },
        asOf,
        transaction,
      );
    const area = siteArea(targets.site.postal_code);
    const state = machineStateLabels[input.machineState];
    for (const company of plan.companies) {
      await run(
        `INSERT INTO service_request_invitations (request_id, company_id, source, invited_at) VALUES ($1, $2, $3, $4)`,
        [id, company.companyId, company.source, asOf],
        transaction,
      );
      await tellCompany(
        company.companyId,
        {
          kind: "service_request.invited",
          title: `Service request #${id}: ${state.toLowerCase()}, ${area.city} ${area.state}`.trim(),
          lines: [
            `A shop near ${area.city}, ${area.state} ${area.postalCode} asks for ${requestKindLabels[input.kind].toLowerCase()} on a ${targets.technology} (${state.toLowerCase()}).`,
            `Problem: ${input.problem}`,
            "Answer with an estimate or pass.",
          ],
          link: requestLink(linkBase, id, "service"),
        },
        transaction,
      );
    }
    await run(
      "INSERT INTO service_request_events (request_id, actor_user_id, kind, note) VALUES ($1, $2, 'sent', $3)",
      [id, buyer.id, `Sent to ${plan.count} ${plan.count === 1 ? "company" : "companies"}`],
      transaction,
    );
    await recordAudit(
      {
        actorUserId: buyer.id,
        action: "service_request.raised",
        subjectType: "service_request",
        subjectId: id,
        after: { ...input, invited: plan.companies.map((c) => c.companyId) },
      },
      transaction,
    );
    if (alongside) await alongside(id, transaction);
    return { id, invited: plan.count };
  });
}
