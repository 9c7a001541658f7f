import { randomUUID } from "node:crypto";
import type { RequestHandler, Response } from "express";
import { log } from "../log.ts";

declare module "node:http" {
  interface IncomingMessage {
    /** The request's id (the caller's X-Request-Id, or a fresh one), named in its log lines. */
    id: string;
  }
}

type Level = "silent" | "info" | "error";

// A caller's id is kept only when it looks like one (a proxy's UUID or token), so a header cannot fill log lines.
const CALLER_REQUEST_ID = /^[\w.:-]{1,128}$/;

export function requestIdOf(header: string | string[] | undefined): string {
  return typeof header === "string" && CALLER_REQUEST_ID.test(header) ? header : randomUUID();
}

/**
 * One line per API request when it finishes, through the one logger and its serializers (so its redaction), with the
 * shape pino-http gave it ({ req, res, responseTime }). A successful request in production writes nothing, and then
 * nothing is serialized either: pino-http built a child logger with the serialized request on every request, logged or
 * not, which cost more than the rest of the logging put together on the hot pages.
 */
export function requestLog(production: boolean): RequestHandler {
  const levelOf = (res: Response, failed: boolean): Level =>
    failed || res.statusCode >= 500 ? "error" : res.statusCode < 400 && production ? "silent" : "info";
  return (req, res, next) => {
    req.id = requestIdOf(req.headers["x-request-id"]);
    if (!req.url.startsWith("/api")) return next();
    const started = Date.now();
    const finished = (err?: unknown) => {
      res.off("finish", finished);
      res.off("close", finished);
      res.off("error", finished);
      const failed = err instanceof Error;
      const level = levelOf(res, failed);
      if (level === "silent") return;
      const responseTime = Date.now() - started;
      // The shapes pino-http handed the serializers: the URL as requested, the headers as sent.
      const reqShown = { id: req.id, method: req.method, url: req.originalUrl, headers: req.headers };
      const resShown = { statusCode: res.statusCode, headers: res.getHeaders() as Record<string, unknown> };
      if (level === "error")
        log.error(
          {
            req: reqShown,
            res: resShown,
            err: failed ? err : new Error(`failed with status code ${res.statusCode}`),
            responseTime,
          },
          "request errored",
        );
      else
        log.info(
          { req: reqShown, res: resShown, responseTime },
          !req.readableAborted && res.writableEnded ? "request completed" : "request aborted",
        );
    };
    res.on("finish", finished);
    res.on("close", finished);
    res.on("error", finished);
    next();
  };
}
