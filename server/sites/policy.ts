import { requireOwnership, requireRole, signedIn, type SignedInUser } from "../http/policy.ts";
import { Equipment, Site } from "./model.ts";

/** The site belongs to the buyer's own shop; another shop's site answers 404 like a missing one. */
export async function isOwnSite(user: SignedInUser, siteId: unknown): Promise<boolean> {
  const site = await Site.findByPk(Number(siteId), { attributes: ["companyId"] });
  return site !== null && site.companyId === user.companyId;
}

export const canListSites = requireRole("buyer");
export const canAddSite = requireRole("buyer");

export const canManageSite = requireOwnership(
  requireRole("buyer"),
  "a site of the buyer's shop",
  (user, params) => isOwnSite(user, params.siteId),
);

export const canManageEquipment = requireOwnership(
  requireRole("buyer"),
  "a machine at a site of the buyer's shop",
  async (user, params) => {
    const equipment = await Equipment.findByPk(Number(params.equipmentId), { attributes: ["siteId"] });
    return (
      equipment !== null &&
      equipment.siteId === Number(params.siteId) &&
      (await isOwnSite(user, params.siteId))
    );
  },
);

// Anyone signed in may look up a ZIP code: the service company's forms use it too.
export const canLookUpPostalCode = signedIn;
