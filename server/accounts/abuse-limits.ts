import { createHash } from "node:crypto";
import { rateLimit, ipKeyGenerator } from "express-rate-limit";
import type { Request, RequestHandler } from "express";
import type { Config } from "../config.ts";
import { AppError } from "../http/app-error.ts";

const MINUTE = 60_000;

interface LimitSpec {
  windowMs: number;
  limit: number;
  /** The key counted; undefined skips this limiter (e.g. a body without an e-mail, refused later by its schema). */
  key: (req: Request) => string | undefined;
  /** Count only refused requests (a wrong password, a bad link), so people who get it right are never slowed. */
  failuresOnly: boolean;
  message: string;
}

const byIp = (req: Request) => ipKeyGenerator(req.ip ?? "");
const byEmail = (req: Request) => {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === "string" && email ? email.trim().toLowerCase() : undefined;
};
// A link's token is the account it names; only its digest is kept in memory.
const byLink = (req: Request) => {
  const token = (req.body as { token?: unknown } | undefined)?.token;
  return typeof token === "string" && token ? createHash("sha256").update(token).digest("hex") : undefined;
};

function limiter(spec: LimitSpec): RequestHandler {
  const limit = rateLimit({
    windowMs: spec.windowMs,
    limit: spec.limit,
    skipSuccessfulRequests: spec.failuresOnly,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    skip: (req) => spec.key(req) === undefined,
    keyGenerator: (req) => spec.key(req)!,
    handler: (_req, _res, next) => next(new AppError("too_many_requests", spec.message)),
  });
  return limit;
}

export type AbuseLimitName =
  "signIn" | "signUp" | "passwordReset" | "setPassword" | "zipLookup" | "gateCheck" | "brokerLink";

// Common practice: a broker opens the page and uploads a handful of times; 30 in 15 minutes per address leaves room for
// retries and stops a machine walking tokens.
const BROKER_LINK_CALLS_PER_IP_PER_15_MIN = 30;

// Common practice: the sign-up form asks once per ZIP typed; 30 a minute per address is plenty for people and too slow
// to copy the ZIP table through it.
const ZIP_LOOKUPS_PER_IP_PER_MINUTE = 30;

/**
 * Per address and per account limits of the four anonymous account routes, built once per app (counts are kept in
 * memory, per instance). Both must pass: the address limit stops one machine rotating e-mails, the account limit stops
 * many machines aiming at one person.
 */
export function createAbuseLimits(config: Config): Record<AbuseLimitName, RequestHandler[]> {
  const wait = (minutes: number) => `wait ${minutes} minutes and try again`;
  return {
    signIn: [
      limiter({
        windowMs: 15 * MINUTE,
        limit: config.SIGN_IN_FAILURES_PER_IP_PER_15_MIN,
        key: byIp,
        failuresOnly: true,
        message: `Too many failed sign-ins from this address; ${wait(15)}`,
      }),
      limiter({
        windowMs: 15 * MINUTE,
        limit: config.SIGN_IN_ATTEMPTS_PER_15_MIN,
        key: byEmail,
        failuresOnly: true,
        message: `Too many failed sign-ins; ${wait(15)}`,
      }),
    ],
    signUp: [
      limiter({
        windowMs: 60 * MINUTE,
        limit: config.SIGN_UPS_PER_IP_PER_HOUR,
        key: byIp,
        failuresOnly: false,
        message: `Too many sign-ups from this address; ${wait(60)}`,
      }),
      limiter({
        windowMs: 60 * MINUTE,
        limit: config.SIGN_UPS_PER_EMAIL_PER_HOUR,
        key: byEmail,
        failuresOnly: false,
        message: `Too many sign-ups with this e-mail; ${wait(60)}`,
      }),
    ],
    passwordReset: [
      limiter({
        windowMs: 15 * MINUTE,
        limit: config.PASSWORD_RESETS_PER_IP_PER_15_MIN,
        key: byIp,
        failuresOnly: false,
        message: `Too many reset requests from this address; ${wait(15)}`,
      }),
      limiter({
        windowMs: 60 * MINUTE,
        limit: config.PASSWORD_RESETS_PER_EMAIL_PER_HOUR,
        key: byEmail,
        failuresOnly: false,
        message: `Too many reset requests for this e-mail; ${wait(60)}`,
      }),
    ],
    zipLookup: [
      limiter({
        windowMs: MINUTE,
        limit: ZIP_LOOKUPS_PER_IP_PER_MINUTE,
        key: byIp,
        failuresOnly: false,
        message: "Too many ZIP look-ups from this address; wait a minute and try again",
      }),
    ],
    gateCheck: [
      limiter({
        windowMs: MINUTE,
        limit: config.GATE_CHECKS_PER_IP_PER_MINUTE,
        key: byIp,
        failuresOnly: false,
        message: "Too many gate checks from this address; wait a minute and try again",
      }),
    ],
    brokerLink: [
      limiter({
        windowMs: 15 * MINUTE,
        limit: BROKER_LINK_CALLS_PER_IP_PER_15_MIN,
        key: byIp,
        failuresOnly: false,
        message: `Too many uses of upload links from this address; ${wait(15)}`,
      }),
    ],
    setPassword: [
      limiter({
        windowMs: 15 * MINUTE,
        limit: config.SET_PASSWORD_FAILURES_PER_IP_PER_15_MIN,
        key: byIp,
        failuresOnly: true,
        message: `Too many attempts with set-password links from this address; ${wait(15)}`,
      }),
      limiter({
        windowMs: 15 * MINUTE,
        limit: config.SET_PASSWORD_FAILURES_PER_LINK_PER_15_MIN,
        key: byLink,
        failuresOnly: true,
        message: `Too many attempts with this link; ${wait(15)}`,
      }),
    ],
  };
}

/** The app's limiters for one route (createApp keeps them in app.locals.abuseLimits). */
export function abuseLimit(name: AbuseLimitName): RequestHandler {
  return (req, res, next) => {
    const all = (req.app.locals as { abuseLimits?: Record<AbuseLimitName, RequestHandler[]> }).abuseLimits;
    const chain = all?.[name] ?? [];
    let i = 0;
    const step = (err?: unknown) => {
      if (err) return next(err);
      const h = chain[i++];
      if (!h) return next();
      void h(req, res, step);
    };
    step();
  };
}
