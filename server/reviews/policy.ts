import { requireOwnership, requireRole, type SignedInUser } from "../http/policy.ts";
import { mayReadTechnicianReviews } from "../../shared/visibility/technician-visibility.ts";
import { Technician, viewLevelOf } from "../technicians/index.ts";
import { WorkOrder, sideOf } from "../work-orders/index.ts";
import { JobReview } from "./model.ts";

/** A buyer of the shop that raised the work order; every other shop's buyer gets the 404 of a missing one. */
export const canWriteReview = requireOwnership(
  requireRole("buyer"),
  "a buyer of the shop that raised it",
  async (user, params) => {
    const workOrder = await WorkOrder.findByPk(Number(params.workOrderId), { attributes: ["shopCompanyId"] });
    return workOrder?.shopCompanyId === user.companyId;
  },
);

export const canReadWorkOrderReview = requireOwnership(
  requireRole("buyer", "provider_admin", "technician"),
  "either side of the work order",
  async (user, params) => {
    const workOrder = await WorkOrder.findByPk(Number(params.workOrderId), {
      attributes: ["shopCompanyId", "serviceCompanyId", "technicianId"],
    });
    return workOrder ? sideOf(user, workOrder) !== null : false;
  },
);

async function technicianCompanyOf(review: JobReview): Promise<number | undefined> {
  return (await Technician.findByPk(review.technicianId, { attributes: ["companyId"] }))?.companyId;
}

/** The rated technician's company admin: the service company answers once, in its own name. */
export const canReplyToReview = requireOwnership(
  requireRole("provider_admin"),
  "of the rated technician's company",
  async (user, params) => {
    const review = await JobReview.findByPk(Number(params.reviewId));
    return review ? (await technicianCompanyOf(review)) === user.companyId : false;
  },
);

export async function isPartyToReview(user: SignedInUser, review: JobReview): Promise<boolean> {
  if (user.role === "buyer") return review.shopCompanyId === user.companyId;
  if (user.role === "technician") return user.technicianId === review.technicianId;
  if (user.role === "provider_admin") return (await technicianCompanyOf(review)) === user.companyId;
  return false;
}

export const canReportReview = requireOwnership(
  requireRole("buyer", "provider_admin", "technician"),
  "either side of the job",
  async (user, params) => {
    const review = await JobReview.findByPk(Number(params.reviewId));
    return review ? isPartyToReview(user, review) : false;
  },
);

export const canModerateReviews = requireRole("admin");

/** Whoever the shared rule shows the technician's profile to; a rival company's staff get the 404 of a missing id. */
export const canReadTechnicianReviews = requireOwnership(
  requireRole("provider_admin", "technician", "reviewer", "buyer", "admin"),
  "whoever may see the technician's profile",
  async (user, params) => mayReadTechnicianReviews(await viewLevelOf(user, Number(params.technicianId))),
);
