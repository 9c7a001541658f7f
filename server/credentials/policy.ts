import { requireOwnership, requireRole, type SignedInUser } from "../http/policy.ts";
import { isTechnicianManagedBy } from "../technicians/policy.ts";
import { viewLevelOf } from "../technicians/visibility.ts";
import { atLeast, BUYER_DOWNLOADABLE_CATEGORIES } from "../../shared/visibility/technician-visibility.ts";
import { Credential, CredentialType, Document } from "./model.ts";

export const canReviewCredentials = requireRole("reviewer");
export const canUploadDocuments = requireRole("provider_admin", "technician");
// A certificate of insurance is held by the company, so only its office sends the coverages read from one.
export const canSubmitCoverages = requireRole("provider_admin");
export const canListOwnCredentials = requireRole("provider_admin", "technician");
export const canEditCatalogue = requireRole("admin");
export const canReadCatalogue = requireRole("provider_admin", "technician", "reviewer", "buyer", "admin");

/** Who may see one credential: its company's admin, its technician, reviewers and admins; buyers once verified. */
export async function canSeeCredential(user: SignedInUser, credential: Credential): Promise<boolean> {
  switch (user.role) {
    case "reviewer":
    case "admin":
      return true;
    case "buyer":
      // A technician's own card only while the shared rule shows them to shops; company policies once verified.
      if (credential.state !== "verified") return false;
      return (
        credential.technicianId === null ||
        atLeast(await viewLevelOf(user, credential.technicianId), "directory")
      );
    case "provider_admin":
      return credential.companyId === user.companyId;
    case "technician":
      return credential.technicianId !== null && credential.technicianId === user.technicianId;
  }
}

export const canViewCredential = requireOwnership(
  requireRole("provider_admin", "technician", "reviewer", "buyer", "admin"),
  "own company, own card, reviewer/admin, or a buyer once verified",
  async (user, params) => {
    const credential = await Credential.findByPk(Number(params.credentialId));
    return credential ? canSeeCredential(user, credential) : false;
  },
);

/**
 * Files: the uploading company's admin and the technician it concerns, reviewers and admins; buyers only
 * a certificate of insurance that has been verified.
 */
export async function canReadDocument(user: SignedInUser, documentId: number): Promise<boolean> {
  const document = await Document.findByPk(documentId, { attributes: ["id", "companyId", "uploadedBy"] });
  if (!document) return false;
  if (user.role === "reviewer" || user.role === "admin") return true;
  if (user.role === "provider_admin") return document.companyId === user.companyId;
  const credentials = await Credential.findAll({
    where: { documentId },
    attributes: ["state", "typeCode", "technicianId", "companyId"],
  });
  if (user.role === "technician") {
    return (
      document.uploadedBy === user.id ||
      credentials.some((c) => c.technicianId !== null && c.technicianId === user.technicianId)
    );
  }
  if (user.role === "buyer") {
    const verified = credentials.filter((c) => c.state === "verified").map((c) => c.typeCode);
    if (verified.length === 0) return false;
    return (
      (await CredentialType.count({
        where: { code: verified, category: [...BUYER_DOWNLOADABLE_CATEGORIES] },
      })) > 0
    );
  }
  return false;
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
