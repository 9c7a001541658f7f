import { pino } from "pino";

// The one logger. Its level is set from the validated config at start-up (configureLog).
export const log = pino({ level: "info" });

export function configureLog(level: string): void {
  log.level = level;
}
