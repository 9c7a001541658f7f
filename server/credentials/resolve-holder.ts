import { AppError } from "../http/app-error.ts";
import type { CredentialType } from "./model.ts";
import { canSubmitFor } from "./policy.ts";

/**
 * Who a document or credential is for: a technician signs in as themself, an office submits for the company or one
 * of its technicians. The type decides which of the two it must be. Returns the technician id, or undefined for the
 * company; another company's technician answers like a missing one.
 */
export async function resolveHolder(
  user: Express.User,
  type: CredentialType,
  requestedTechnicianId: number | undefined,
): Promise<number | undefined> {
  const technicianId =
    user.role === "technician"
      ? (requestedTechnicianId ?? user.technicianId ?? undefined)
      : requestedTechnicianId;
  if (type.holder === "technician" && technicianId === undefined) {
    throw new AppError("invalid_input", "Choose the technician this card belongs to", [
      { path: "body.technicianId", message: "required for this type" },
    ]);
  }
  if (type.holder === "company" && technicianId !== undefined) {
    throw new AppError("invalid_input", "This type is held by the company, not a technician", [
      { path: "body.technicianId", message: "must be empty for this type" },
    ]);
  }
  if (!(await canSubmitFor(user, technicianId)))
    throw new AppError("not_found", "That technician was not found");
  return technicianId;
}
