import type { GateCheckLogQuery } from "@shared/gate/check-log.ts";

export const gateKeys = {
  all: ["gate"] as const,
  checks: (filters: GateCheckLogQuery) => [...gateKeys.all, "checks", filters] as const,
};
