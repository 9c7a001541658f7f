import { requireOwnership, requireRole } from "../http/policy.ts";
import { atLeast } from "../../shared/visibility/technician-visibility.ts";
import { viewLevelOf } from "../technicians/visibility.ts";

export const canSearchDirectory = requireRole("buyer");

// A technician the shared rule hides from shops (not cleared, inactive, or unknown) answers 404, so nothing leaks.
export const canViewListedTechnician = requireOwnership(
  requireRole("buyer"),
  "a listed technician",
  async (user, params) => atLeast(await viewLevelOf(user, Number(params.technicianId)), "directory"),
);
