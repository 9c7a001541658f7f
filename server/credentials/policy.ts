import { requireOwnership, requireRole, type SignedInUser } from "../http/policy.ts";
import { isTechnicianManagedBy } from "../technicians/policy.ts";
import { viewLevelOf } from "../technicians/visibility.ts";
import { atLeast } from "../../shared/visibility/technician-visibility.ts";
import { Op, type WhereOptions } from "sequelize";
import { credentialReadScope } from "../../shared/credentials/read-rules.ts";
import { Credential } from "./model.ts";
import { documentAccessFor } from "./document-access.ts";

/** The shared credential read scope as a where clause: the list and the single read both use it. */
export function credentialScopeWhere(user: SignedInUser): WhereOptions {
  const scope = credentialReadScope(user);
  switch (scope.kind) {
    case "all":
      return {};
    case "verified":
      return { state: "verified" };
    case "company":
      return { companyId: scope.companyId };
    case "technician":
      return { companyId: scope.companyId, technicianId: scope.technicianId };
    case "none":
      return { id: -1 };
  }
}

export const canReviewCredentials = requireRole("reviewer");
export const canUploadDocuments = requireRole("provider_admin", "technician");
// A certificate of insurance is held by the company, so only its office sends the coverages read from one.
export const canSubmitCoverages = requireRole("provider_admin");
export const canListOwnCredentials = requireRole("provider_admin", "technician");
export const canEditCatalogue = requireRole("admin");
export const canReadCatalogue = requireRole("provider_admin", "technician", "reviewer", "buyer", "admin");

/**
 * Who may see one credential: the same scope the list is read with (shared/credentials/read-rules.ts); for a buyer, a
 * technician's own card only while the shared technician rule shows that technician to shops.
 */
export async function canSeeCredential(user: SignedInUser, credentialId: number): Promise<boolean> {
  const credential = await Credential.findOne({
    where: { [Op.and]: [{ id: credentialId }, credentialScopeWhere(user)] },
    attributes: ["id", "technicianId"],
  });
  if (!credential) return false;
  if (user.role !== "buyer" || credential.technicianId === null) return true;
  return atLeast(await viewLevelOf(user, credential.technicianId), "directory");
}

export const canViewCredential = requireOwnership(
  requireRole("provider_admin", "technician", "reviewer", "buyer", "admin"),
  "own company, own card, reviewer/admin, or a buyer once verified",
  async (user, params) => {
    return canSeeCredential(user, Number(params.credentialId));
  },
);

/** Files: the shared read rule (shared/credentials/read-rules.ts), one answer for every role. */
export async function canReadDocument(user: SignedInUser, documentId: number): Promise<boolean> {
  return (await documentAccessFor(user, documentId)) !== "none";
}

export const canDownloadDocument = requireOwnership(
  requireRole("provider_admin", "technician", "reviewer", "buyer", "admin"),
  "uploading company, its technician, reviewer/admin, or a buyer for a verified certificate",
  (user, params) => canReadDocument(user, Number(params.documentId)),
);

/** A provider_admin may submit for the company or its technicians; a technician only for themself. */
export async function canSubmitFor(user: SignedInUser, technicianId: number | undefined): Promise<boolean> {
  if (technicianId === undefined) return user.role === "provider_admin";
  return isTechnicianManagedBy(user, technicianId);
}
