import { demoCompanies } from "./companies.ts";
import { demoCalendar } from "./demo-calendar.ts";
import type { DemoWorld } from "./demo-world-types.ts";
import { demoInsurance } from "./insurance.ts";
import { demoTechnicians } from "./technicians.ts";
import { demoTraining } from "./training.ts";

/** The whole invented world as plain values, every date relative to `today`; no I/O and no clock. */
export function buildDemoWorld(today: Date): DemoWorld {
  const calendar = demoCalendar(today);
  return {
    today: calendar.today,
    companies: demoCompanies,
    technicians: demoTechnicians,
    credentials: [...demoInsurance(calendar), ...demoTraining(calendar)],
  };
}
