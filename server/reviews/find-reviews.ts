import { Op, QueryTypes, literal } from "sequelize";
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
    "SELECT count(*)::int AS count, sum(stars)::int AS star_sum FROM job_reviews WHERE technician_id = $1 AND excluded_at IS NULL",
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

/** The admin's queue: reported reviews, oldest report first, then those flagged as possible self-rating. */
export async function listReportedReviews() {
  const rows = await JobReview.findAll({
    where: {
      [Op.or]: [{ reportedAt: { [Op.ne]: null } }, literal("cardinality(self_rating_signals) > 0")],
    },
    order: [
      [literal("reported_at IS NULL"), "ASC"],
      ["reportedAt", "ASC"],
      ["createdAt", "ASC"],
    ],
    limit: REPORTED_LIMIT,
  });
  return toReportedReviewDtos(rows);
}
