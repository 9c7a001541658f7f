import type { ComparisonDto, ComparisonRowDto } from "../../shared/service-requests/schemas.ts";
import { ratingSummary } from "../directory/estimates.ts";
import { AppError } from "../http/app-error.ts";
import { standingSnapshotsNow } from "../work-orders/standing-now.ts";
import { findRequest } from "./records.ts";
import { acceptedEstimateCounts, companyResponseMedians } from "./response-times.ts";
import { select, selectOne } from "./sql.ts";
import { loadEstimates } from "./view-request.ts";

/**
 * One row per live estimate (active, or the accepted one): price and its parts, arrival, distance, the technician's
 * standing against the request's set taken now (with how each requirement is met), rating, the company's typical
 * response time and its accepted-estimate count.
 */
export async function compareEstimates(
  buyer: Express.User,
  requestId: number,
  warningDays: number,
  asOf = new Date(),
): Promise<ComparisonDto> {
  const request = await findRequest(requestId);
  if (!request || request.shop_company_id !== buyer.companyId)
    throw new AppError("not_found", "That service request was not found");
  const site = await selectOne<{ time_zone: string }>("SELECT time_zone FROM sites WHERE id = $1", [
    request.site_id,
  ]);
  const estimates = (await loadEstimates(requestId)).filter(
    (e) => e.status === "active" || e.status === "accepted",
  );
  const companyIds = estimates.map((e) => e.companyId);
  const technicianIds = estimates.map((e) => e.current.technicianId);
  const [medians, accepted, ratings] = await Promise.all([
    companyResponseMedians(companyIds, asOf),
    acceptedEstimateCounts(companyIds),
    select<{ technician_id: number; review_count: number; star_sum: number }>(
      "SELECT technician_id, review_count, star_sum FROM technician_ratings WHERE technician_id = ANY($1::int[])",
      [technicianIds],
    ),
  ]);
  // Every estimate's technician at once: three statements for the page, not three per estimate.
  const snapshots = await standingSnapshotsNow(technicianIds, request.requirement_set_id, asOf, warningDays);
  const rows: ComparisonRowDto[] = [];
  for (const e of estimates) {
    const snapshot = snapshots.get(e.current.technicianId);
    if (!snapshot) throw new Error(`No technician ${e.current.technicianId}`);
    const rating = ratings.find((r) => r.technician_id === e.current.technicianId);
    rows.push({
      estimateId: e.id,
      companyId: e.companyId,
      companyName: e.companyName,
      technicianId: e.current.technicianId,
      technicianName: e.current.technicianName,
      standing: snapshot.standing,
      requirements: snapshot.targets.flatMap((t) =>
        t.requirements.map((r) => ({
          label: `${t.name}: ${r.label}`,
          status: r.status,
          detail: r.credential?.reference
            ? `${r.detail} (${r.credential.typeName} ${r.credential.reference})`
            : r.detail,
        })),
      ),
      distanceMiles: e.current.distanceMiles,
      driveHours: e.current.driveHours,
      earliestArrival: e.current.earliestArrival,
      total: e.current.total,
      revision: e.current.revision,
      rating: ratingSummary(rating?.review_count ?? 0, rating?.star_sum ?? 0),
      medianResponseMinutes: medians.get(e.companyId) ?? null,
      acceptedEstimates: accepted.get(e.companyId) ?? 0,
      validUntil: e.current.validUntil,
    });
  }
  return { requestId, timeZone: site!.time_zone, rows };
}
