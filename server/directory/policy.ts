import { requireRole } from "../http/policy.ts";

export const canSearchDirectory = requireRole("buyer");

// A technician the shared rule hides from shops (not cleared, inactive, or unknown) answers 404, so nothing leaks: the
// page's own statement reads the rule's facts and the handler applies it (findDirectoryTechnician), one statement less.
export const canViewListedTechnician = requireRole("buyer");
