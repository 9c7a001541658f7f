import type { PublicReviewDto, ReportedReviewDto, ReviewDto } from "../../shared/reviews/schemas.ts";
import { Company } from "../companies/index.ts";
import { User } from "../accounts/index.ts";
import { Technician } from "../technicians/index.ts";
import type { JobReview } from "./model.ts";
import { selfRatingSignalKinds, type SelfRatingSignal } from "../../shared/reviews/self-rating.ts";

async function namesFor(rows: JobReview[]) {
  const ids = (pick: (r: JobReview) => number | null) => [
    ...new Set(rows.flatMap((r) => (pick(r) === null ? [] : [pick(r)!]))),
  ];
  const [shops, users, technicians] = await Promise.all([
    Company.findAll({ where: { id: ids((r) => r.shopCompanyId) }, attributes: ["id", "name"] }),
    User.findAll({
      where: {
        id: [
          ...ids((r) => r.authorUserId),
          ...ids((r) => r.reportedBy),
          ...ids((r) => r.excludedBy),
          ...ids((r) => r.keptBy),
        ],
      },
      attributes: ["id", "name"],
    }),
    Technician.findAll({ where: { id: ids((r) => r.technicianId) }, attributes: ["id", "name"] }),
  ]);
  return {
    shop: new Map(shops.map((c) => [c.id, c.name])),
    user: new Map(users.map((u) => [u.id, u.name])),
    technician: new Map(technicians.map((t) => [t.id, t.name])),
  };
}

function toDto(r: JobReview, names: Awaited<ReturnType<typeof namesFor>>): ReviewDto {
  return {
    id: r.id,
    workOrderId: r.workOrderId,
    technicianId: r.technicianId,
    shopName: names.shop.get(r.shopCompanyId) ?? "",
    authorName: names.user.get(r.authorUserId) ?? "",
    stars: r.stars,
    body: r.body,
    reply: r.reply,
    repliedAt: r.repliedAt?.toISOString() ?? null,
    reported: r.reportedAt !== null,
    createdAt: r.createdAt.toISOString(),
  };
}

export async function toReviewDtos(rows: JobReview[]): Promise<ReviewDto[]> {
  if (rows.length === 0) return [];
  const names = await namesFor(rows);
  return rows.map((r) => toDto(r, names));
}

export async function toReportedReviewDtos(rows: JobReview[]): Promise<ReportedReviewDto[]> {
  if (rows.length === 0) return [];
  const names = await namesFor(rows);
  return rows.map((r) => ({
    ...toDto(r, names),
    reportedAt: r.reportedAt?.toISOString() ?? null,
    reportReason: r.reportReason ?? "",
    selfRatingSignals: r.selfRatingSignals.filter((s): s is SelfRatingSignal =>
      (selfRatingSignalKinds as readonly string[]).includes(s),
    ),
    excluded: r.excludedAt
      ? {
          at: r.excludedAt.toISOString(),
          reason: r.exclusionReason ?? "",
          by: names.user.get(r.excludedBy ?? 0) ?? "",
        }
      : null,
    kept: r.keptAt ? { at: r.keptAt.toISOString(), by: names.user.get(r.keptBy ?? 0) ?? "" } : null,
    reportedBy: { id: r.reportedBy ?? 0, name: names.user.get(r.reportedBy ?? 0) ?? "" },
    technicianName: names.technician.get(r.technicianId) ?? "",
  }));
}

/** A review as the directory shows it: never the shop, the author or the work order, so no one learns who hired whom. */
export function toPublicReviewDto(r: JobReview): PublicReviewDto {
  return {
    id: r.id,
    stars: r.stars,
    text: r.body.length > 0 ? r.body : null,
    reply: r.reply && r.reply.length > 0 ? r.reply : null,
    createdAt: r.createdAt.toISOString(),
  };
}
