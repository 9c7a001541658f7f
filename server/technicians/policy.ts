import { requireOwnership, requireRole, type SignedInUser } from "../http/policy.ts";
import { Technician } from "./model.ts";
import { viewLevelOf } from "./visibility.ts";

async function technicianCompanyId(id: unknown): Promise<number | undefined> {
  const technician = await Technician.findByPk(Number(id), { attributes: ["companyId"] });
  return technician?.companyId;
}

/** The technician's own company admin, or the technician themself. */
export async function isTechnicianManagedBy(user: SignedInUser, technicianId: unknown): Promise<boolean> {
  if (user.role === "technician") return user.technicianId === Number(technicianId);
  if (user.role === "provider_admin") return (await technicianCompanyId(technicianId)) === user.companyId;
  return false;
}

export const canListOwnTechnicians = requireRole("provider_admin");
export const canManageTechnicians = requireRole("provider_admin");

export const canEditTechnician = requireOwnership(
  requireRole("provider_admin"),
  "of the same company",
  (user, params) => isTechnicianManagedBy(user, params.technicianId),
);

/** Anyone the shared visibility rule shows the technician to; everyone else gets the 404 of a missing id. */
export const canViewTechnician = requireOwnership(
  requireRole("provider_admin", "technician", "reviewer", "buyer", "admin"),
  "own company, self, reviewer/admin, or a buyer while the technician is listed",
  async (user, params) => (await viewLevelOf(user, Number(params.technicianId))) !== "none",
);
