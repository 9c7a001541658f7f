import type { CredentialState } from "./schemas.ts";
import type { CredentialCategory } from "./catalogue.ts";
import { sideOf, type Viewer, type WorkOrderParties } from "../work-orders/work-order-side.ts";

/**
 * Which credentials a viewer may read, as a scope rather than a yes/no, so that a list and a single read are the same
 * query with and without an id, and can never disagree. A technician reads their own cards only: the company's
 * insurance and colleagues' cards are the office's business.
 */
export type CredentialReadScope =
  | { kind: "all" }
  | { kind: "company"; companyId: number }
  | { kind: "technician"; companyId: number; technicianId: number }
  | { kind: "verified" }
  | { kind: "none" };

export function credentialReadScope(viewer: Viewer): CredentialReadScope {
  switch (viewer.role) {
    case "reviewer":
    case "admin":
      return { kind: "all" };
    case "buyer":
      return { kind: "verified" };
    case "provider_admin":
      return { kind: "company", companyId: viewer.companyId };
    case "technician":
      return viewer.technicianId === null
        ? { kind: "none" }
        : { kind: "technician", companyId: viewer.companyId, technicianId: viewer.technicianId };
  }
}

/** A stored file with what decides who reads it. */
export interface DocumentFacts {
  companyId: number;
  uploadedBy: number;
  /** The technician it was uploaded for; null for the company or an old upload that did not record it. */
  technicianId: number | null;
  /** The work order whose thread it was posted in; null for a credential document. */
  workOrder: WorkOrderParties | null;
  credentials: {
    companyId: number;
    technicianId: number | null;
    state: CredentialState;
    category: CredentialCategory;
    submittedBy: number;
  }[];
}

/** "dispute": an admin reading a work-order attachment, which is allowed but must leave an audit event. */
export type DocumentAccess = "read" | "dispute" | "none";

/**
 * Who reads a file. A work-order attachment belongs to the two parties of that work order; an admin may open one for
 * a dispute (audited), a reviewer never (it is not a credential document). A credential document: its company's
 * office, the technician it is for, reviewers and admins, and buyers once it backs verified insurance.
 */
export function documentAccess(viewer: Viewer, document: DocumentFacts): DocumentAccess {
  if (document.workOrder) {
    if (sideOf(viewer, document.workOrder) !== null) return "read";
    return viewer.role === "admin" ? "dispute" : "none";
  }
  switch (viewer.role) {
    case "reviewer":
    case "admin":
      return "read";
    case "provider_admin":
      return document.companyId === viewer.companyId ? "read" : "none";
    case "technician": {
      if (viewer.technicianId === null || document.companyId !== viewer.companyId) return "none";
      const own =
        document.uploadedBy === viewer.id ||
        document.technicianId === viewer.technicianId ||
        // A card the office filed for them; one the technician filed on someone else's file does not count.
        document.credentials.some(
          (c) => c.technicianId === viewer.technicianId && c.submittedBy !== viewer.id,
        );
      return own ? "read" : "none";
    }
    case "buyer":
      return document.credentials.some((c) => c.state === "verified" && c.category === "insurance")
        ? "read"
        : "none";
  }
}
