import { Op } from "sequelize";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { JobReview } from "./model.ts";
import { toReviewDtos } from "./dto.ts";

/** The service company's one reply: written only where none exists, so a second attempt finds nothing to update. */
export async function replyToReview(actor: Express.User, reviewId: number, body: string) {
  const review = await db().transaction(async (transaction) => {
    const [count, rows] = await JobReview.update(
      { reply: body, repliedBy: actor.id, repliedAt: new Date() },
      { where: { id: reviewId, reply: { [Op.is]: null } }, returning: true, transaction },
    );
    if (count === 0 || !rows[0])
      throw new AppError("conflict", "This review already has the company's reply");
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "review.replied",
        subjectType: "job_review",
        subjectId: reviewId,
        after: { reply: body },
      },
      transaction,
    );
    return rows[0];
  });
  return (await toReviewDtos([review]))[0]!;
}

/** Flags a review for an admin to look at; the review stays up and is never deleted. The first report is kept. */
export async function reportReview(actor: Express.User, reviewId: number, reason: string) {
  const review = await db().transaction(async (transaction) => {
    const [count, rows] = await JobReview.update(
      { reportedAt: new Date(), reportReason: reason, reportedBy: actor.id },
      { where: { id: reviewId, reportedAt: { [Op.is]: null } }, returning: true, transaction },
    );
    if (count === 0 || !rows[0])
      throw new AppError("conflict", "This review has already been reported and awaits an admin");
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "review.reported",
        subjectType: "job_review",
        subjectId: reviewId,
        after: { reason },
      },
      transaction,
    );
    return rows[0];
  });
  return (await toReviewDtos([review]))[0]!;
}
