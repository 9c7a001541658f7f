import type { Config } from "../server/config.ts";
import { publicUrl } from "../server/config.ts";
import { followUpServiceRequests, type FollowUpReport } from "../server/service-requests/index.ts";

export type FollowUpDeps = Pick<
  Config,
  "SERVICE_REQUEST_REMINDER_HOURS" | "SERVICE_REQUEST_DOWN_REMINDER_HOURS" | "SERVICE_REQUEST_EXPIRY_HOURS"
> & { publicUrl: string };

export function followUpDeps(config: Config): FollowUpDeps {
  return {
    SERVICE_REQUEST_REMINDER_HOURS: config.SERVICE_REQUEST_REMINDER_HOURS,
    SERVICE_REQUEST_DOWN_REMINDER_HOURS: config.SERVICE_REQUEST_DOWN_REMINDER_HOURS,
    SERVICE_REQUEST_EXPIRY_HOURS: config.SERVICE_REQUEST_EXPIRY_HOURS,
    publicUrl: publicUrl(config),
  };
}

/**
 * Reminds invited companies of requests without an estimate past their threshold (business hours at the site), and
 * expires undecided requests. Safe to run from several instances at once: each reminder and expiry is claimed in SQL.
 */
export function runServiceRequestFollowUp(
  { asOf }: { asOf: Date },
  deps: FollowUpDeps,
): Promise<FollowUpReport> {
  return followUpServiceRequests(asOf, {
    normalHours: deps.SERVICE_REQUEST_REMINDER_HOURS,
    downHours: deps.SERVICE_REQUEST_DOWN_REMINDER_HOURS,
    expiryHours: deps.SERVICE_REQUEST_EXPIRY_HOURS,
    linkBase: deps.publicUrl,
  });
}
