import type { Role } from "@shared/accounts/schemas.ts";
import { paths } from "./paths.ts";

/** `end`: current only on exactly this path (a role's home), not on every page below it. */
export type NavItem = { label: string; to: string; end?: boolean };

/** What each role may use; the header shows exactly these links. */
export const navigationByRole: Record<Role, readonly NavItem[]> = {
  provider_admin: [
    { label: "Dashboard", to: paths.provider.dashboard, end: true },
    { label: "Technicians", to: paths.provider.technicians },
    { label: "Credentials", to: paths.provider.documents },
    { label: "Work orders", to: paths.provider.workOrders },
    { label: "Service requests", to: paths.provider.serviceRequests },
    { label: "Company", to: paths.company },
    { label: "Gate checks", to: paths.provider.gateChecks },
    { label: "Brokers", to: paths.provider.brokers },
  ],
  technician: [
    { label: "My standing", to: paths.technician.standing, end: true },
    { label: "Upload a card", to: paths.technician.uploadCard },
    { label: "Work orders", to: paths.provider.workOrders },
  ],
  reviewer: [{ label: "Verification queue", to: paths.reviewer.queue }],
  buyer: [
    { label: "Directory", to: paths.buyer.directory },
    { label: "Roster", to: paths.buyer.roster },
    { label: "Sites", to: paths.buyer.sites },
    { label: "Requirement sets", to: paths.buyer.requirementSets },
    { label: "Work orders", to: paths.buyer.workOrders },
    { label: "Service requests", to: paths.buyer.serviceRequests },
    { label: "Machines", to: paths.buyer.machines },
    { label: "Company", to: paths.company },
    { label: "Gate checks", to: paths.buyer.gateChecks },
    { label: "Certificates", to: paths.buyer.certificateRequests },
  ],
  admin: [
    { label: "Users", to: paths.admin.users },
    { label: "Catalog", to: paths.admin.catalog },
    { label: "Outbox", to: paths.admin.outbox },
    { label: "Platform baseline", to: paths.admin.baseline },
    { label: "Job runs", to: paths.admin.jobRuns },
    { label: "Reported ratings", to: paths.admin.reportedReviews },
    { label: "Follow-up", to: paths.admin.followUp },
    { label: "Machines", to: paths.admin.machineCatalog },
  ],
};

export const homePathByRole: Record<Role, string> = {
  provider_admin: paths.provider.dashboard,
  technician: paths.technician.standing,
  reviewer: paths.reviewer.queue,
  buyer: paths.buyer.directory,
  admin: paths.admin.users,
};

export const roleLabels: Record<Role, string> = {
  provider_admin: "Service company admin",
  technician: "Technician",
  reviewer: "Compliance reviewer",
  buyer: "Buyer",
  admin: "Platform admin",
};
