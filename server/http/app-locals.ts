import type { Request } from "express";
import { publicUrl, type Config } from "../config.ts";

/** The validated config the app was built with (set once in createApp). */
export function appConfig(req: Request): Config {
  return req.app.locals.config as Config;
}

export function linkBase(req: Request): string {
  return publicUrl(appConfig(req));
}
