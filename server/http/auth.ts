import passport from "passport";
import { Strategy as LocalStrategy } from "passport-local";
import session from "express-session";
import connectPgSimple from "connect-pg-simple";
import pg from "pg";
import type { RequestHandler } from "express";
import type { Config } from "../config.ts";
import { findUserBySignIn } from "../accounts/service.ts";
import { toSessionUser } from "../accounts/dto.ts";
import { User } from "../db/models.ts";

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

declare module "express-session" {
  interface SessionData {
    /** When the session's expiry was last pushed back (ms since 1970); changing it makes express-session save the row. */
    renewedAt?: number;
  }
}

/** One working shift of inactivity at most. */
const SESSION_MAX_AGE_MS = 8 * 60 * 60_000;
/** Pushed back once less than this is left, so a working session keeps going without writing its row on every request. */
const RENEW_WHEN_LEFT_MS = SESSION_MAX_AGE_MS / 2;

/**
 * Sessions neither roll nor touch on every request (each was an UPDATE of the session row): a signed-in session is
 * saved with a fresh expiry, and its cookie sent again, only once less than half a shift is left. A session idle for
 * between half a shift and a whole one ends, as before only one idle for a whole shift did.
 */
export const renewSessionNearExpiry: RequestHandler = (req, _res, next) => {
  const left = req.session?.cookie.maxAge;
  if (req.user && typeof left === "number" && left < RENEW_WHEN_LEFT_MS) {
    req.session.touch();
    req.session.renewedAt = Date.now();
  }
  next();
};

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
      // No UPDATE of the row on every request; renewSessionNearExpiry saves it when its expiry must move.
      disableTouch: true,
    }),
    resave: false,
    saveUninitialized: false,
    rolling: false,
    proxy: config.NODE_ENV === "production",
    cookie: {
      httpOnly: true,
      sameSite: "lax",
      secure: config.NODE_ENV === "production",
      maxAge: SESSION_MAX_AGE_MS,
    },
  });
}

export { passport };
