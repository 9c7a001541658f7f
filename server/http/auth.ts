import passport from "passport";
import { Strategy as LocalStrategy } from "passport-local";
import session from "express-session";
import connectPgSimple from "connect-pg-simple";
import pg from "pg";
import type { RequestHandler } from "express";
import type { Config } from "../config.ts";
import { User } from "../accounts/model.ts";
import { findUserBySignIn } from "../accounts/service.ts";
import { toSessionUser } from "../accounts/dto.ts";

export const SESSION_COOKIE = "clearbench.sid";

passport.use(
  new LocalStrategy({ usernameField: "email", passwordField: "password" }, (email, password, done) => {
    findUserBySignIn(email, password).then(
      (user) => done(null, user ? toSessionUser(user) : false),
      (err: unknown) => done(err),
    );
  }),
);
passport.serializeUser((user, done) => done(null, user.id));
// Runs on every signed-in request: only the columns the session user needs (never the password hash), one index probe,
// read as a plain row rather than a model instance.
const SESSION_USER_COLUMNS = ["id", "email", "name", "role", "companyId", "technicianId"] as const;
passport.deserializeUser((id: number, done) => {
  User.findOne({ where: { id, active: true }, attributes: [...SESSION_USER_COLUMNS], raw: true }).then(
    (user) => done(null, user ? toSessionUser(user) : false),
    (err: unknown) => done(err),
  );
});

/** Sessions live in PostgreSQL (table `session`), so any server instance can serve any request. */
export function sessionMiddleware(config: Config, pool: pg.Pool): RequestHandler {
  const PgStore = connectPgSimple(session);
  return session({
    name: SESSION_COOKIE,
    secret: config.SESSION_SECRET,
    store: new PgStore({
      pool,
      tableName: "session",
      createTableIfMissing: false,
      pruneSessionInterval: 15 * 60,
    }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.NODE_ENV === "production",
    cookie: {
      httpOnly: true,
      sameSite: "lax",
      secure: config.NODE_ENV === "production",
      maxAge: 8 * 60 * 60_000, // one working shift
    },
  });
}

export { passport };
