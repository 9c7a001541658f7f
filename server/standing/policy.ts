import { requireOwnership, requireRole, signedIn } from "../http/policy.ts";
import { isTechnicianManagedBy, Technician } from "../technicians/index.ts";
import { RequirementSet } from "./model.ts";

export const canReadBaseline = signedIn;
export const canEditBaseline = requireRole("admin");
export const canReadJobRuns = requireRole("admin");

export const canListRequirementSets = requireRole("buyer");

/** A buyer of the shop that owns the set; another shop's set answers 404, like a missing one. */
export const canManageRequirementSet = requireOwnership(
  requireRole("buyer"),
  "of the same shop",
  async (user, params) => {
    const set = await RequirementSet.findByPk(Number(params.requirementSetId), { attributes: ["companyId"] });
    return set?.companyId === user.companyId;
  },
);

/** The technician, their company's admin, or a reviewer or admin (buyers read standings through the directory). */
export const canViewTechnicianStanding = requireOwnership(
  requireRole("provider_admin", "technician", "reviewer", "admin"),
  "own company, self, or a reviewer/admin",
  async (user, params) => {
    if (user.role === "reviewer" || user.role === "admin") {
      return (await Technician.count({ where: { id: Number(params.technicianId) } })) > 0;
    }
    return isTechnicianManagedBy(user, params.technicianId);
  },
);
