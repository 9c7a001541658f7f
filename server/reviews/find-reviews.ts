import { Op, QueryTypes } from "sequelize";
import type { TechnicianReviewsDto } from "../../shared/reviews/schemas.ts";
import { db } from "../db/sequelize.ts";
import { JobReview } from "./model.ts";
import { toPublicReviewDto, toReportedReviewDtos, toReviewDtos } from "./dto.ts";

const REPORTED_LIMIT = 200;

/** Average with its count over every review, then one page of them, newest first. */
export async function listTechnicianReviews(
  technicianId: number,
  page: { limit: number; before?: number | undefined },
): Promise<TechnicianReviewsDto> {
  const [totals] = await db().query<{ count: number; star_sum: number | null }>(
    "SELECT count(*)::int AS count, sum(stars)::int AS star_sum FROM job_reviews WHERE technician_id = $1",
    { bind: [technicianId], type: QueryTypes.SELECT },
  );
  const rows = await JobReview.findAll({
    where: { technicianId, ...(page.before ? { id: { [Op.lt]: page.before } } : {}) },
    order: [["id", "DESC"]],
    limit: page.limit,
  });
  const count = totals?.count ?? 0;
  return {
    average: count > 0 ? (totals!.star_sum ?? 0) / count : null,
    count,
    items: rows.map(toPublicReviewDto),
  };
}

export async function findWorkOrderReview(workOrderId: number) {
  const row = await JobReview.findOne({ where: { workOrderId } });
  return { review: row ? (await toReviewDtos([row]))[0]! : null };
}

/** The admin's queue of flagged reviews, oldest report first. */
export async function listReportedReviews() {
  const rows = await JobReview.findAll({
    where: { reportedAt: { [Op.ne]: null } },
    order: [["reportedAt", "ASC"]],
    limit: REPORTED_LIMIT,
  });
  return toReportedReviewDtos(rows);
}
