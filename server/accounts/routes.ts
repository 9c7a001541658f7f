import type { NextFunction, Request, Response } from "express";
import { z } from "zod";
import {
  adminCompanyDtoSchema,
  adminUserDtoSchema,
  invitedUserDtoSchema,
  currentUserSchema,
  inviteUserSchema,
  userParamsSchema,
  passwordResetAnswerSchema,
  requestPasswordResetSchema,
  setPasswordSchema,
  signInSchema,
  signUpSchema,
} from "../../shared/accounts/schemas.ts";
import type { Config } from "../config.ts";
import { createRoutes } from "../http/route.ts";
import { anyone, signedIn } from "../http/policy.ts";
import { AppError } from "../http/app-error.ts";
import { linkBase } from "../http/app-locals.ts";
import { passport, SESSION_COOKIE } from "../http/auth.ts";
import { kickOutbox } from "../mail/outbox.ts";
import { canManageUsers } from "./policy.ts";
import { abuseLimit } from "./abuse-limits.ts";
import { toSessionUser } from "./dto.ts";
import { listCompanies, listUsers, setUserActive } from "./user-status.ts";
import {
  findCurrentUser,
  inviteUser,
  requestPasswordReset,
  setPasswordWithToken,
  signUpCompany,
} from "./service.ts";

export const authRoutes = createRoutes("/api/auth");
export const adminUserRoutes = createRoutes("/api/admin");

function authenticate(req: Request, res: Response, next: NextFunction): Promise<Express.User | false> {
  return new Promise((resolve, reject) => {
    passport.authenticate("local", { session: false }, (err: unknown, user: Express.User | false) =>
      err ? reject(err) : resolve(user),
    )(req, res, next);
  });
}

// passport 0.7 regenerates the session id inside logIn, so a planted id never becomes signed in.
const logIn = (req: Request, user: Express.User) =>
  new Promise<void>((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())));

async function meOrThrow(userId: number) {
  const found = await findCurrentUser(userId);
  if (!found) throw new AppError("unauthenticated", "Sign in first");
  return found.dto;
}

authRoutes.post(
  "/sign-in",
  { allow: anyone, before: [abuseLimit("signIn")], body: signInSchema, response: currentUserSchema },
  async (req, res, { body }) => {
    req.body = body;
    const user = await authenticate(req, res, () => undefined);
    if (!user) throw new AppError("unauthenticated", "That e-mail and password do not match an account");
    await logIn(req, user);
    return meOrThrow(user.id);
  },
);

authRoutes.post("/sign-out", { allow: anyone }, async (req, res) => {
  await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
  await new Promise<void>((resolve) => (req.session ? req.session.destroy(() => resolve()) : resolve()));
  res.clearCookie(SESSION_COOKIE);
  res.status(204).end();
});

authRoutes.get("/me", { allow: signedIn, response: currentUserSchema }, async (req) =>
  meOrThrow(req.user!.id),
);

authRoutes.post(
  "/sign-up",
  { allow: anyone, before: [abuseLimit("signUp")], body: signUpSchema, response: currentUserSchema },
  async (req, res, { body }) => {
    const user = await signUpCompany(body);
    await logIn(req, toSessionUser(user));
    res.status(201);
    return await meOrThrow(user.id);
  },
);

authRoutes.post(
  "/password-reset",
  {
    allow: anyone,
    before: [abuseLimit("passwordReset")],
    body: requestPasswordResetSchema,
    response: passwordResetAnswerSchema,
    status: 202,
  },
  async (req, _res, { body }) => {
    await requestPasswordReset(body.email, linkBase(req), req.app.locals.config as Config);
    kickOutbox(req.app.locals);
    return { message: "If that e-mail has an account, a reset link is on its way." };
  },
);

authRoutes.post(
  "/set-password",
  { allow: anyone, before: [abuseLimit("setPassword")], body: setPasswordSchema },
  async (req, _res, { body }) => {
    await setPasswordWithToken(body, req.sessionID);
  },
);

adminUserRoutes.get("/users", { allow: canManageUsers, response: z.array(adminUserDtoSchema) }, () =>
  listUsers(),
);
adminUserRoutes.get("/companies", { allow: canManageUsers, response: z.array(adminCompanyDtoSchema) }, () =>
  listCompanies(),
);
adminUserRoutes.post(
  "/invitations",
  { allow: canManageUsers, body: inviteUserSchema, response: invitedUserDtoSchema },
  async (req, res, { body }) => {
    const invited = await inviteUser(req.user!, body, linkBase(req));
    kickOutbox(req.app.locals);
    res.status(201);
    return invited;
  },
);

adminUserRoutes.post(
  "/users/:userId/deactivate",
  { allow: canManageUsers, params: userParamsSchema, response: adminUserDtoSchema },
  (req, _res, { params }) => setUserActive(req.user!, params.userId, false),
);

adminUserRoutes.post(
  "/users/:userId/reactivate",
  { allow: canManageUsers, params: userParamsSchema, response: adminUserDtoSchema },
  (req, _res, { params }) => setUserActive(req.user!, params.userId, true),
);
