import { Transaction, UniqueConstraintError } from "sequelize";
import type { Config } from "../config.ts";
import type { InviteUser, SetPassword, SignUp } from "../../shared/accounts/schemas.ts";
import { db } from "../db/sequelize.ts";
import { AppError } from "../http/app-error.ts";
import { placeOfCompany } from "../companies/index.ts";
import { enqueueMail } from "../mail/outbox.ts";
import { recordAudit } from "../audit/index.ts";
import { User } from "./model.ts";
import { checkPassword, hashPassword } from "./passwords.ts";
import {
  consumeToken,
  isUsableToken,
  issueToken,
  resetIssuedWithin,
  revokeOutstandingTokens,
} from "./tokens.ts";
import { endSessionsOfUser } from "./end-sessions.ts";
import { inviteMail, resetMail } from "./emails.ts";
import { toCurrentUserDto } from "./dto.ts";
import { Company } from "../db/models.ts";

const emailTaken = () =>
  new AppError("conflict", "An account with this e-mail already exists", [
    { path: "body.email", message: "already in use" },
  ]);

export async function signUpCompany(input: SignUp) {
  // A taken e-mail is refused before the costly hash; the unique index still decides a race.
  if (await User.findOne({ where: { email: input.email }, attributes: ["id"] })) throw emailTaken();
  // The zone of the mailing address, never a choice: every policy period of the company is read in it.
  const place = placeOfCompany(input.postalCode);
  const passwordHash = await hashPassword(input.password);
  try {
    return await db().transaction(async (transaction) => {
      const company = await Company.create(
        {
          name: input.companyName,
          kind: input.kind,
          addressLine: input.addressLine,
          postalCode: place.postalCode,
          timeZone: place.timeZone,
          latitude: place.latitude,
          longitude: place.longitude,
        },
        { transaction },
      );
      const user = await User.create(
        {
          companyId: company.id,
          email: input.email,
          name: input.name,
          role: input.kind === "service" ? "provider_admin" : "buyer",
          passwordHash,
        },
        { transaction },
      );
      await recordAudit(
        {
          actorUserId: user.id,
          action: "company.signed_up",
          subjectType: "company",
          subjectId: company.id,
          after: { name: company.name, kind: company.kind },
        },
        transaction,
      );
      return user;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw emailTaken();
    throw err;
  }
}

/** The same answer, and about the same time, whether the e-mail is unknown or the password wrong. */
export async function findUserBySignIn(email: string, password: string): Promise<User | null> {
  const user = await User.findOne({ where: { email: email.toLowerCase(), active: true } });
  const ok = await checkPassword(password, user?.passwordHash);
  return ok ? user : null;
}

export async function findCurrentUser(userId: number) {
  const user = await User.findOne({ where: { id: userId, active: true } });
  if (!user) return null;
  const company = await Company.findByPk(user.companyId);
  if (!company) return null;
  return { user, dto: toCurrentUserDto(user, company) };
}

/**
 * Queues a reset e-mail, at most one per account per RESET_EMAIL_INTERVAL_MINUTES; the caller answers the same whether
 * the e-mail is unknown, throttled or sent. The user row is locked so parallel requests cannot each send one.
 */
export async function requestPasswordReset(
  email: string,
  linkBase: string,
  config: Pick<Config, "RESET_EMAIL_INTERVAL_MINUTES">,
): Promise<void> {
  await db().transaction(async (transaction) => {
    const user = await User.findOne({
      where: { email: email.toLowerCase(), active: true },
      lock: Transaction.LOCK.UPDATE,
      transaction,
    });
    if (!user) return;
    if (await resetIssuedWithin(user.id, config.RESET_EMAIL_INTERVAL_MINUTES, transaction)) return;
    const token = await issueToken(user.id, "reset", transaction);
    await enqueueMail(
      resetMail(user.email, user.name, `${linkBase}/set-password?token=${token}`),
      transaction,
    );
  });
}

const linkExpired = () =>
  new AppError("invalid_input", "This link has expired or was already used", [
    { path: "body.token", message: "expired or used" },
  ]);

/**
 * The link is checked before the password is hashed (a bogus link costs one index probe, not a bcrypt hash), then used
 * in one statement. Setting a password ends every other session of the user and every other outstanding link.
 */
export async function setPasswordWithToken(input: SetPassword, keepSessionId?: string): Promise<void> {
  if (!(await isUsableToken(input.token))) throw linkExpired();
  const passwordHash = await hashPassword(input.password);
  await db().transaction(async (transaction) => {
    const userId = await consumeToken(input.token, transaction);
    if (!userId) throw linkExpired();
    await User.update({ passwordHash }, { where: { id: userId }, transaction });
    const revokedLinks = await revokeOutstandingTokens(userId, transaction);
    const endedSessions = await endSessionsOfUser(userId, keepSessionId, transaction);
    await recordAudit(
      {
        actorUserId: userId,
        action: "user.password_set",
        subjectType: "user",
        subjectId: userId,
        after: { revokedLinks, endedSessions },
      },
      transaction,
    );
  });
}

export async function inviteUser(actor: Express.User, input: InviteUser, linkBase: string) {
  const company = await Company.findByPk(input.companyId);
  if (!company)
    throw new AppError("invalid_input", "No such company", [
      { path: "body.companyId", message: "unknown company" },
    ]);
  const fits =
    (company.kind === "service" && ["provider_admin", "technician"].includes(input.role)) ||
    (company.kind === "shop" && input.role === "buyer") ||
    (company.kind === "platform" && ["reviewer", "admin"].includes(input.role));
  if (!fits) {
    throw new AppError("invalid_input", `A ${company.kind} company cannot have a ${input.role}`, [
      { path: "body.role", message: "does not fit the company" },
    ]);
  }
  return createInvitedUser(actor, company, input, linkBase);
}

/** Creates a user without a password and e-mails a one-time link to set one (admin invites, technician accounts). */
export async function createInvitedUser(
  actor: Express.User,
  company: Company,
  input: { email: string; name: string; role: InviteUser["role"]; technicianId?: number },
  linkBase: string,
) {
  try {
    return await db().transaction(async (transaction) => {
      const user = await User.create(
        {
          companyId: company.id,
          email: input.email,
          name: input.name,
          role: input.role,
          passwordHash: null,
          technicianId: input.technicianId ?? null,
        },
        { transaction },
      );
      const token = await issueToken(user.id, "invite", transaction);
      await enqueueMail(
        inviteMail(user.email, user.name, company.name, `${linkBase}/set-password?token=${token}`, user.role),
        transaction,
      );
      await recordAudit(
        {
          actorUserId: actor.id,
          action: "user.invited",
          subjectType: "user",
          subjectId: user.id,
          after: { email: user.email, role: user.role, companyId: company.id },
        },
        transaction,
      );
      return { id: user.id, email: user.email, name: user.name, role: user.role, companyId: company.id };
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw emailTaken();
    throw err;
  }
}
