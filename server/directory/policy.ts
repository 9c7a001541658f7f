import { requireOwnership, requireRole } from "../http/policy.ts";
import { isListedTechnician } from "./technician-profile.ts";

export const canSearchDirectory = requireRole("buyer");

// A technician who is not listed (not cleared, inactive, or unknown) answers 404 to buyers, so nothing about them leaks.
export const canViewListedTechnician = requireOwnership(
  requireRole("buyer"),
  "a listed technician",
  (_user, params) => isListedTechnician(Number(params.technicianId)),
);
