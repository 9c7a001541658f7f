import { requireOwnership, requireRole, type SignedInUser } from "../http/policy.ts";
import { isTechnicianManagedBy } from "../technicians/policy.ts";
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
export const canListOwnCredentials = requireRole("provider_admin", "technician");
export const canEditCatalogue = requireRole("admin");
export const canReadCatalogue = requireRole("provider_admin", "technician", "reviewer", "buyer", "admin");

/** Who may see one credential: the same scope the list is read with (shared/credentials/read-rules.ts). */
export async function canSeeCredential(user: SignedInUser, credentialId: number): Promise<boolean> {
  return (
    (await Credential.count({ where: { [Op.and]: [{ id: credentialId }, credentialScopeWhere(user)] } })) > 0
  );
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
