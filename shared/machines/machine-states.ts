import type { MachineState } from "../sites/schemas.ts";

/** The words for a machine's state, the same on every screen and export. */
export const machineStateLabels: Record<MachineState, string> = {
  running: "Running",
  down: "Down",
  out_of_service: "Out of service",
  sold: "Sold",
};
