import { rateLimit, ipKeyGenerator } from "express-rate-limit";
import type { RequestHandler } from "express";
import { AppError } from "../http/app-error.ts";

/** Built once per app in createApp (the limiter keeps its counts in memory). */
export function createSignInLimiter(limit: number): RequestHandler {
  return rateLimit({
    windowMs: 15 * 60_000,
    limit,
    skipSuccessfulRequests: true,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? "")}|${String(req.body?.email ?? "").toLowerCase()}`,
    handler: (_req, _res, next) =>
      next(new AppError("too_many_requests", "Too many failed sign-ins; wait 15 minutes and try again")),
  });
}

/** Failed sign-ins per address and e-mail in 15 minutes (successful ones do not count). */
export const signInRateLimit: RequestHandler = (req, res, next) => {
  const limiter = (req.app.locals as { signInLimiter?: RequestHandler }).signInLimiter;
  if (!limiter) return next();
  return limiter(req, res, next);
};
