import type { RequestHandler } from "express";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";
import { AppError } from "./app-error.ts";

const SAFE = new Set(["GET", "HEAD", "OPTIONS"]);

// SameSite=Lax stops most cross-site posts; a custom header adds a second lock, because a
// cross-site form cannot set headers and a cross-site fetch with one needs a CORS preflight we never grant.
export const requireCsrfHeader: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method) || req.get(CSRF_HEADER) === CSRF_HEADER_VALUE) return next();
  next(new AppError("forbidden", `State-changing requests need the ${CSRF_HEADER} header`));
};
