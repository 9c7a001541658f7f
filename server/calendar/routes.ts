import { z } from "zod";
import {
  calendarFeedStatusDtoSchema,
  createdCalendarFeedDtoSchema,
  stoppedCalendarFeedDtoSchema,
} from "../../shared/calendar/schemas.ts";
import { publicUrl } from "../config.ts";
import { appConfig } from "../http/app-locals.ts";
import { notFound } from "../http/app-error.ts";
import { anyone, requireRole } from "../http/policy.ts";
import { createRoutes } from "../http/route.ts";
import { calendarFeedStatus, calendarFor, rotateCalendarFeed, stopCalendarFeed } from "./feed.ts";

export const calendarRoutes = createRoutes("/api");

// The service company's office (its own credentials) and a shop's buyer (its roster) each have one feed.
const canManageCalendarFeed = requireRole("provider_admin", "buyer");

const feedUrl = (base: string, secret: string) => new URL(`/api/calendar/${secret}.ics`, base).toString();

calendarRoutes.get(
  "/calendar-feed",
  { allow: canManageCalendarFeed, response: calendarFeedStatusDtoSchema },
  (req) => calendarFeedStatus(req.user!),
);

calendarRoutes.post(
  "/calendar-feed",
  { allow: canManageCalendarFeed, response: createdCalendarFeedDtoSchema },
  async (req, res) => {
    const { secret } = await rotateCalendarFeed(req.user!);
    res.status(201);
    return { active: true as const, url: feedUrl(publicUrl(appConfig(req)), secret) };
  },
);

calendarRoutes.delete(
  "/calendar-feed",
  { allow: canManageCalendarFeed, response: stoppedCalendarFeedDtoSchema },
  (req) => stopCalendarFeed(req.user!),
);

// Calendar programs fetch without cookies, so the unguessable secret in the address is the only key.
calendarRoutes.get(
  "/calendar/:secret.ics",
  {
    allow: anyone,
    params: z.object({ secret: z.string().regex(/^[A-Za-z0-9_-]{32}$/, "Not a calendar address") }),
  },
  async (req, res, { params }) => {
    const config = appConfig(req);
    const text = await calendarFor(params.secret, {
      warningDays: config.WARNING_DAYS,
      publicUrl: publicUrl(config),
    });
    if (text === null) throw notFound("That calendar");
    res.type("text/calendar; charset=utf-8").setHeader("Cache-Control", "private, max-age=300").send(text);
  },
);
