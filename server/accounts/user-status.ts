import { QueryTypes } from "sequelize";
import type { AdminCompanyDto, AdminUserDto, UserStatus } from "../../shared/accounts/schemas.ts";
import { db } from "../db/sequelize.ts";
import { AppError } from "../http/app-error.ts";
import { recordAudit } from "../audit/index.ts";
import { User } from "./model.ts";
import { endSessionsOfUser } from "./end-sessions.ts";
import { Company } from "../db/models.ts";

export function statusOf(user: Pick<User, "active" | "passwordHash">): UserStatus {
  if (!user.active) return "deactivated";
  return user.passwordHash === null ? "invited" : "active";
}

export async function listUsers(): Promise<AdminUserDto[]> {
  const [users, companies] = await Promise.all([User.findAll({ order: [["id", "ASC"]] }), Company.findAll()]);
  const names = new Map(companies.map((c) => [c.id, c.name]));
  return users.map((u) => toAdminUserDto(u, names.get(u.companyId) ?? ""));
}

function toAdminUserDto(u: User, companyName: string): AdminUserDto {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    companyId: u.companyId,
    companyName,
    status: statusOf(u),
  };
}

/**
 * Deactivates or reactivates a user. Deactivating deletes every session of theirs in the same transaction, so their
 * next request is answered 401 at once (sign-in and session loading already refuse an inactive user). An admin
 * cannot lock themselves out.
 */
export async function setUserActive(
  admin: Express.User,
  userId: number,
  active: boolean,
): Promise<AdminUserDto> {
  const user = await db().transaction(async (transaction) => {
    const row = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw new AppError("not_found", "That user was not found");
    if (row.id === admin.id && !active)
      throw new AppError("conflict", "You cannot deactivate your own account; ask another admin");
    if (row.active === active)
      throw new AppError(
        "conflict",
        active ? "This user is active already" : "This user is deactivated already",
      );
    const before = statusOf(row);
    await row.update({ active }, { transaction });
    const endedSessions = active ? 0 : await endSessionsOfUser(row.id, undefined, transaction);
    await recordAudit(
      {
        actorUserId: admin.id,
        action: active ? "user.reactivated" : "user.deactivated",
        subjectType: "user",
        subjectId: row.id,
        before: { status: before },
        after: { status: statusOf(row), endedSessions },
      },
      transaction,
    );
    return row;
  });
  const company = await Company.findByPk(user.companyId, { attributes: ["name"] });
  return toAdminUserDto(user, company?.name ?? "");
}

/** Every company with how many users, technicians and active sites it has, so an admin sees who is on the platform. */
export async function listCompanies(): Promise<AdminCompanyDto[]> {
  const rows = await db().query<{
    id: number;
    name: string;
    kind: AdminCompanyDto["kind"];
    created_at: Date;
    users: number;
    technicians: number;
    sites: number;
  }>(
    `SELECT c.id, c.name, c.kind, c.created_at,
            (SELECT count(*)::int FROM users u WHERE u.company_id = c.id) AS users,
            (SELECT count(*)::int FROM technicians t WHERE t.company_id = c.id) AS technicians,
            (SELECT count(*)::int FROM sites s WHERE s.company_id = c.id AND s.active) AS sites
       FROM companies c ORDER BY c.name ASC, c.id ASC`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    kind: r.kind,
    createdAt: new Date(r.created_at).toISOString(),
    users: r.users,
    technicians: r.technicians,
    sites: r.sites,
  }));
}
