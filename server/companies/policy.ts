import { requireRole } from "../http/policy.ts";

// A company's own administrators: the service company's office and the shop's buyers. The route takes no id, so a
// caller can only ever read or move their own company.
export const canManageOwnCompany = requireRole("provider_admin", "buyer");
