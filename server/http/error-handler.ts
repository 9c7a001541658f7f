import type { ErrorRequestHandler, RequestHandler } from "express";
import { ZodError } from "zod";
import { MulterError } from "multer";
import { AppError } from "./app-error.ts";
import { log } from "../log.ts";
import { MAX_UPLOAD_SIZE_WORDS } from "../../shared/credentials/upload-limits.ts";

function zodToAppError(err: ZodError, where: string): AppError {
  const fields = err.issues.map((i) => ({
    path: [where, ...i.path.map(String)].join("."),
    message: i.message,
  }));
  return new AppError(
    where === "body" ? "invalid_input" : "bad_request",
    "Some fields need attention",
    fields,
  );
}

const CONNECTION_ERRORS = new Set([
  "SequelizeConnectionError",
  "SequelizeConnectionRefusedError",
  "SequelizeConnectionAcquireTimeoutError",
  "SequelizeHostNotReachableError",
]);

// Connection-level failures from pg itself (the session store): the database is down or restarting.
const PG_DOWN_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "57P01", "57P02", "57P03", "08006", "08001"]);

/** The database refused or dropped the connection (also when wrapped by Sequelize as `parent`). */
export function isDatabaseDown(err: unknown): boolean {
  const e = err as
    { name?: string; code?: string; message?: string; parent?: unknown; original?: unknown } | undefined;
  if (!e || typeof e !== "object") return false;
  if (e.name && CONNECTION_ERRORS.has(e.name)) return true;
  if (e.code && PG_DOWN_CODES.has(e.code)) return true;
  if (
    typeof e.message === "string" &&
    /Connection terminated|terminating connection|the database system is (starting up|shutting down)/i.test(
      e.message,
    )
  )
    return true;
  return isDatabaseDown(e.parent) || isDatabaseDown(e.original);
}

/** Turns anything thrown into a known error, or undefined when it is a bug. */
export function toAppError(err: unknown): AppError | undefined {
  if (err instanceof AppError) return err;
  if (err instanceof ZodError) return zodToAppError(err, "body");
  if (err instanceof MulterError) {
    if (err.code === "LIMIT_FILE_SIZE")
      return new AppError("too_large", `The file is larger than ${MAX_UPLOAD_SIZE_WORDS}`, [
        { path: "file", message: `larger than ${MAX_UPLOAD_SIZE_WORDS}` },
      ]);
    return new AppError("bad_request", `Upload refused: ${err.message}`, [
      { path: err.field ?? "file", message: err.message },
    ]);
  }
  const e = err as { type?: string; status?: number; name?: string };
  if (e?.type === "entity.parse.failed")
    return new AppError("bad_request", "The request body is not valid JSON");
  if (e?.type === "entity.too.large") return new AppError("too_large", "The request body is too large");
  if (isDatabaseDown(err))
    return new AppError("unavailable", "The database is unavailable; try again shortly");
  return undefined;
}

export { zodToAppError };

// The only place an error becomes a response; details of unknown errors go to the log, never to the client.
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const known = toAppError(err);
  if (!known) log.error({ err, requestId: req.id }, "unhandled error");
  const e = known ?? new AppError("internal", "Something went wrong");
  if (res.headersSent) return;
  res.status(e.status).json({ error: { code: e.code, message: e.message, fields: e.fields } });
};

export const apiNotFound: RequestHandler = (_req, _res, next) => {
  next(new AppError("not_found", "No such API route"));
};
