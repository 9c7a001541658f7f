import { z } from "zod";

/**
 * The readiness answer (200 when ok, 503 otherwise). The replica fields appear only when a read replica is configured,
 * and `starting` only while the instance is still migrating or loading.
 */
export const readinessDtoSchema = z.object({
  status: z.enum(["ok", "starting", "degraded"]),
  database: z.enum(["up", "down"]),
  replica: z.enum(["up", "down"]).optional(),
  /** Seconds since the last change replayed from the primary; only while the replica is up. */
  replicaLagSeconds: z.number().optional(),
  starting: z.array(z.string()).optional(),
});
export type ReadinessDto = z.infer<typeof readinessDtoSchema>;

export const livenessDtoSchema = z.object({ status: z.literal("alive") });
