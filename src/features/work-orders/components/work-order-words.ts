import type { Urgency } from "@shared/work-orders/schemas.ts";

export const urgencyWords: Record<Urgency, string> = {
  low: "Low: when convenient",
  normal: "Normal",
  high: "High: within a day or two",
  down: "Machine down: production stopped",
};
