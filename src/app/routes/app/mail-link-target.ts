import type { Role } from "@shared/accounts/schemas.ts";
import { homePathByRole } from "@/config/navigation.ts";
import { paths } from "@/config/paths.ts";

export type MailLink = "documents" | "documentNew";

/**
 * Decision and renewal e-mails link to role-neutral URLs; each role lands on its own page for them,
 * with the query (type, technicianId) carried along so the upload flow opens with them chosen.
 */
export function mailLinkTarget(link: MailLink, role: Role, search: string): string {
  if (role === "provider_admin") {
    return `${link === "documentNew" ? paths.provider.documentNew : paths.provider.documents}${search}`;
  }
  if (role === "technician" && link === "documentNew") return `${paths.technician.uploadCard}${search}`;
  return homePathByRole[role];
}
