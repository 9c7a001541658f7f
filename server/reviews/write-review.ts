import { UniqueConstraintError, type Transaction } from "sequelize";
import type { WriteReview } from "../../shared/reviews/schemas.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { WorkOrder } from "../work-orders/index.ts";
import { JobReview } from "./model.ts";
import { toReviewDtos } from "./dto.ts";
import { findSelfRatingSignals } from "./self-rating-check.ts";

/** The directory's running totals, kept in the review's own transaction so a count never disagrees with the reviews. */
async function addToRatings(technicianId: number, stars: number, transaction: Transaction) {
  await db().query(
    `INSERT INTO technician_ratings (technician_id, review_count, star_sum, updated_at) VALUES ($1, 1, $2, CURRENT_TIMESTAMP)
     ON CONFLICT (technician_id) DO UPDATE
       SET review_count = technician_ratings.review_count + 1, star_sum = technician_ratings.star_sum + EXCLUDED.star_sum,
           updated_at = CURRENT_TIMESTAMP`,
    { bind: [technicianId, stars], transaction },
  );
}

/**
 * One review per confirmed work order, by a buyer of the shop that raised it. Who is rated and who rates come from the
 * work order and the session, never from the request; the database's unique key refuses a second review.
 */
export async function writeReview(buyer: Express.User, workOrderId: number, input: WriteReview) {
  try {
    const review = await db().transaction(async (transaction) => {
      const workOrder = await WorkOrder.findByPk(workOrderId, { transaction, lock: transaction.LOCK.SHARE });
      if (!workOrder || workOrder.shopCompanyId !== buyer.companyId)
        throw new AppError("not_found", "That work order was not found");
      if (workOrder.status !== "confirmed")
        throw new AppError("forbidden", "Only a work order the shop has confirmed can be rated");
      const row = await JobReview.create(
        {
          workOrderId,
          technicianId: workOrder.technicianId,
          shopCompanyId: workOrder.shopCompanyId,
          authorUserId: buyer.id,
          stars: input.stars,
          body: input.body,
          selfRatingSignals: await findSelfRatingSignals(
            workOrder.shopCompanyId,
            workOrder.serviceCompanyId,
            transaction,
          ),
        },
        { transaction },
      );
      await addToRatings(workOrder.technicianId, input.stars, transaction);
      await recordAudit(
        {
          actorUserId: buyer.id,
          action: "review.written",
          subjectType: "job_review",
          subjectId: row.id,
          after: { workOrderId, stars: input.stars },
        },
        transaction,
      );
      return row;
    });
    return (await toReviewDtos([review]))[0]!;
  } catch (err) {
    if (err instanceof UniqueConstraintError)
      throw new AppError("conflict", "This work order has already been rated");
    throw err;
  }
}
