import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { JobReview } from "./model.ts";
import { toReportedReviewDtos } from "./dto.ts";

/**
 * Leaves a reported review, or one flagged as possible self-rating, out of the technician's score. The review stays (reviews are never
 * deleted); the running totals lose its stars in the same transaction, so the stored ranking score (computed from
 * them) recomputes at once.
 */
export async function excludeReviewFromScore(admin: Express.User, reviewId: number, reason: string) {
  const review = await db().transaction(async (transaction) => {
    const row = await JobReview.findByPk(reviewId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw new AppError("not_found", "That review was not found");
    if (row.selfRatingSignals.length === 0 && row.reportedAt === null)
      throw new AppError(
        "conflict",
        "Only a reported review, or one flagged as possible self-rating, can be left out of the score",
      );
    if (row.excludedAt !== null)
      throw new AppError("conflict", "This review is already left out of the score");
    await row.update(
      { excludedAt: new Date(), excludedBy: admin.id, exclusionReason: reason, keptAt: null, keptBy: null },
      { transaction },
    );
    await db().query(
      `UPDATE technician_ratings SET review_count = review_count - 1, star_sum = star_sum - $2,
              updated_at = CURRENT_TIMESTAMP
        WHERE technician_id = $1`,
      { bind: [row.technicianId, row.stars], transaction },
    );
    await recordAudit(
      {
        actorUserId: admin.id,
        action: "review.excluded_from_score",
        subjectType: "job_review",
        subjectId: row.id,
        before: { excluded: false },
        after: { excluded: true, reason, signals: row.selfRatingSignals },
      },
      transaction,
    );
    return row;
  });
  return (await toReportedReviewDtos([review]))[0]!;
}

/**
 * Settles a report by keeping the review counted as it is. Nothing about the review changes; the decision is recorded
 * so the queue shows it settled, and audited. A review already left out of the score is not put back this way.
 */
export async function keepReportedReview(admin: Express.User, reviewId: number) {
  const review = await db().transaction(async (transaction) => {
    const row = await JobReview.findByPk(reviewId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw new AppError("not_found", "That review was not found");
    if (row.selfRatingSignals.length === 0 && row.reportedAt === null)
      throw new AppError("conflict", "Only a reported or flagged review awaits a decision");
    if (row.excludedAt !== null)
      throw new AppError("conflict", "This review is already left out of the score");
    if (row.keptAt !== null) throw new AppError("conflict", "This review has been kept already");
    await row.update({ keptAt: new Date(), keptBy: admin.id }, { transaction });
    await recordAudit(
      {
        actorUserId: admin.id,
        action: "review.kept",
        subjectType: "job_review",
        subjectId: row.id,
        after: { kept: true, reportReason: row.reportReason, signals: row.selfRatingSignals },
      },
      transaction,
    );
    return row;
  });
  return (await toReportedReviewDtos([review]))[0]!;
}
