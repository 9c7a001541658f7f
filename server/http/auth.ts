import passport from "passport";
import { Strategy as LocalStrategy } from "passport-local";
import session from "express-session";
import connectPgSimple from "connect-pg-simple";
import type { IncomingMessage } from "node:http";
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
passport.deserializeUser(
  (req: IncomingMessage, id: number, done: (err: unknown, user?: Express.User | false) => void) => {
    // Normally the session read already brought the user's row (SessionUserStore below): no second statement.
    const prefetched = takePrefetchedUser(req, id);
    if (prefetched !== undefined) {
      done(null, prefetched ? toSessionUser(prefetched as User) : false);
      return;
    }
    User.findOne({ where: { id, active: true }, attributes: [...SESSION_USER_COLUMNS], raw: true }).then(
      (user) => done(null, user ? toSessionUser(user) : false),
      (err: unknown) => done(err),
    );
  },
);

/** The session user's columns, as the joined session read returns them (null when the user is gone or inactive). */
type PrefetchedUser = Pick<User, (typeof SESSION_USER_COLUMNS)[number]>;
const PREFETCHED = Symbol("clearbench.sessionUser");
// The joined read's user travels from the store's get() to createSession() inside the session object, under a key no
// session data uses, and is taken off before express-session copies or hashes the data.
const PREFETCH_KEY = "__clearbenchSessionUser";

type RequestWithPrefetch = IncomingMessage & { [PREFETCHED]?: { id: number; user: PrefetchedUser | null } };

function takePrefetchedUser(req: IncomingMessage, id: number): PrefetchedUser | null | undefined {
  const r = req as RequestWithPrefetch;
  const found = r[PREFETCHED];
  delete r[PREFETCHED];
  return found && found.id === id ? found.user : undefined;
}

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

/**
 * connect-pg-simple, with the session row and its signed-in user read in one statement: every signed-in request used to
 * send two (the session, then the user), and the user is still read fresh each time, so a deactivated account or a
 * changed role takes effect at the next request as before.
 */
function sessionUserStore(pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  return class SessionUserStore extends PgStore {
    override get(sid: string, fn: (err: unknown, sess?: session.SessionData | null) => void): void {
      pool
        .query<{ sess: session.SessionData | string; user: PrefetchedUser | null }>({
          // Prepared once per connection: it runs on every signed-in request.
          name: "clearbench_session_user",
          text: `SELECT s.sess, CASE WHEN u.id IS NULL THEN NULL ELSE json_build_object('id', u.id, 'email', u.email,
                  'name', u.name, 'role', u.role, 'companyId', u.company_id, 'technicianId', u.technician_id) END AS user
             FROM session s
             LEFT JOIN users u ON jsonb_typeof(s.sess::jsonb #> '{passport,user}') = 'number'
              AND u.id = (s.sess::jsonb #>> '{passport,user}')::int AND u.active
            WHERE s.sid = $1 AND s.expire >= CURRENT_TIMESTAMP`,
          values: [sid],
        })
        .then(
          ({ rows }) => {
            const row = rows[0];
            if (!row) return fn(null, null);
            let sess: session.SessionData;
            try {
              sess = typeof row.sess === "string" ? (JSON.parse(row.sess) as session.SessionData) : row.sess;
            } catch {
              return this.destroy(sid, (err) => fn(err));
            }
            (sess as unknown as Record<string, unknown>)[PREFETCH_KEY] = row.user;
            fn(null, sess);
          },
          (err: unknown) => fn(err),
        );
    }

    override createSession(
      req: IncomingMessage,
      sess: session.SessionData,
    ): session.Session & session.SessionData {
      const data = sess as unknown as Record<string, unknown> & { passport?: { user?: unknown } };
      if (PREFETCH_KEY in data) {
        const id = data.passport?.user;
        if (typeof id === "number")
          (req as RequestWithPrefetch)[PREFETCHED] = {
            id,
            user: data[PREFETCH_KEY] as PrefetchedUser | null,
          };
        delete data[PREFETCH_KEY];
      }
      return super.createSession(req as Parameters<session.Store["createSession"]>[0], sess);
    }
  };
}

/** Sessions live in PostgreSQL (table `session`), so any server instance can serve any request. */
export function sessionMiddleware(config: Config, pool: pg.Pool): RequestHandler {
  const SessionUserStore = sessionUserStore(pool);
  return session({
    name: SESSION_COOKIE,
    secret: config.SESSION_SECRET,
    store: new SessionUserStore({
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
