import { requireOwnership, requireRole } from "../http/policy.ts";
import { sideFor } from "./records.ts";

export const canRaiseServiceRequests = requireRole("buyer");
export const canListServiceRequests = requireRole("buyer", "provider_admin");
export const canFollowUp = requireRole("admin");

/** The shop that raised it, an invited company, or a coordinator; anyone else gets the same 404 as a missing one. */
export const canSeeServiceRequest = requireOwnership(
  requireRole("buyer", "provider_admin", "admin"),
  "the shop, an invited company or a coordinator",
  async (user, params) => (await sideFor(user, Number(params.requestId))) !== null,
);

export const canDecideServiceRequest = requireOwnership(
  requireRole("buyer"),
  "the shop that raised it",
  async (user, params) => (await sideFor(user, Number(params.requestId))) === "shop",
);

export const canAnswerServiceRequest = requireOwnership(
  requireRole("provider_admin"),
  "an invited company",
  async (user, params) => (await sideFor(user, Number(params.requestId))) === "service",
);

export const canSeeThread = requireOwnership(
  requireRole("buyer", "provider_admin"),
  "the shop or that company",
  async (user, params) => {
    const side = await sideFor(user, Number(params.requestId));
    return side === "shop" || (side === "service" && Number(params.companyId) === user.companyId);
  },
);
