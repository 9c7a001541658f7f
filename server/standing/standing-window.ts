import { loadConfig } from "../config.ts";
import { lapsingWindowOf } from "../../shared/standing/warning-windows.ts";

let windowDays: number | undefined;

/**
 * A requirement is "lapsing" inside the widest configured warning window (config WARNING_DAYS), so the first warning
 * e-mail and the "Lapsing" badge appear together. Read once: the server, the job and the check must all agree.
 */
export function lapsingWindowDays(): number {
  windowDays ??= lapsingWindowOf(loadConfig().WARNING_DAYS);
  return windowDays;
}
