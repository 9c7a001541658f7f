import type { Express, RequestHandler } from "express";
import { AppError } from "../http/app-error.ts";

/**
 * What the instance is still doing before it can serve what it announces (migrating, loading the demo scenario...).
 * Empty means ready. createApp starts empty, so an app built without startServer (tests) is ready at once.
 */
export class Readiness {
  private readonly pending = new Set<string>();

  get starting(): string[] {
    return [...this.pending];
  }

  /** Marks the instance not ready until the returned function runs. */
  hold(what: string): () => void {
    this.pending.add(what);
    return () => this.pending.delete(what);
  }
}

export const readinessOf = (app: Express): Readiness => app.locals.readiness as Readiness;

/** Until ready, every API request but the health checks answers 503 rather than a misleading 401 or empty list. */
export const refuseWhileStarting: RequestHandler = (req, res, next) => {
  const starting = (req.app.locals.readiness as Readiness | undefined)?.starting ?? [];
  if (!starting.length || req.path.startsWith("/health")) return next();
  res.setHeader("Retry-After", "5");
  next(
    new AppError(
      "unavailable",
      `Clearbench is starting (${starting.join(", ")}); try again in a few seconds`,
    ),
  );
};
