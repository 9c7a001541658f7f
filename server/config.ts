import { createHmac } from "node:crypto";
import { DEFAULT_WARNING_DAYS } from "../shared/standing/warning-windows.ts";
import { z } from "zod";

// The only file that reads process.env. Demo defaults are built in so `npm start` just works;
// production refuses to start without a real session secret.
const booleanText = z.enum(["true", "false", "1", "0"]).transform((v) => v === "true" || v === "1");

const configSchema = z
  .object({
    NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
    HOST: z.string().default("127.0.0.1"),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    PUBLIC_URL: z.url().optional(),
    DATABASE_URL: z.string().optional(),
    // A streaming replica for the read-heavy pages; a session that wrote reads from the primary for a while after.
    DATABASE_REPLICA_URL: z
      .string()
      .regex(/^postgres(ql)?:\/\//, "must be a postgres:// or postgresql:// address")
      .optional(),
    READ_YOUR_WRITES_SECONDS: z.coerce.number().int().min(0).max(3600).default(10),
    // Parse every answer of a route that declares its response schema and answer 500 on a mismatch: on in the tests,
    // off in production (the parse costs time and the schema is already checked by the type system).
    CHECK_RESPONSE_SHAPES: booleanText.default(false),
    PG_PORT: z.coerce.number().int().min(1024).max(65535).default(54329),
    SMTP_URL: z.string().optional(),
    SMTP_CATCHER_PORT: z.coerce.number().int().min(1024).max(65535).default(2525),
    MAIL_FROM: z.string().default("Clearbench <no-reply@clearbench.test>"),
    SESSION_SECRET: z.string().min(16).default("clearbench-demo-secret-change-me"),
    // Signs the gate badge tokens; when unset (development and tests only) it is derived from SESSION_SECRET.
    GATE_SECRET: z.string().min(32).optional(),
    UPLOADS_DIR: z.string().default("uploads"),
    LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
    // Limits of the anonymous account routes (per address and per account, counted in memory per instance).
    SIGN_IN_ATTEMPTS_PER_15_MIN: z.coerce.number().int().min(1).default(10),
    SIGN_IN_FAILURES_PER_IP_PER_15_MIN: z.coerce.number().int().min(1).default(50),
    SIGN_UPS_PER_IP_PER_HOUR: z.coerce.number().int().min(1).default(20),
    SIGN_UPS_PER_EMAIL_PER_HOUR: z.coerce.number().int().min(1).default(5),
    PASSWORD_RESETS_PER_IP_PER_15_MIN: z.coerce.number().int().min(1).default(20),
    PASSWORD_RESETS_PER_EMAIL_PER_HOUR: z.coerce.number().int().min(1).default(10),
    SET_PASSWORD_FAILURES_PER_IP_PER_15_MIN: z.coerce.number().int().min(1).default(20),
    SET_PASSWORD_FAILURES_PER_LINK_PER_15_MIN: z.coerce.number().int().min(1).default(5),
    // Common practice: a front desk scans a few badges a minute; 60 a minute per address stops guessing tokens.
    GATE_CHECKS_PER_IP_PER_MINUTE: z.coerce.number().int().min(1).default(60),
    RESET_EMAIL_INTERVAL_MINUTES: z.coerce.number().int().min(0).max(1440).default(5),
    HASH_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(2),
    HASH_QUEUE: z.coerce.number().int().min(0).max(10_000).default(16),
    BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(12),
    JOB_TIME_ZONE: z.string().default("America/Chicago"),
    JOB_CRON: z.string().default("0 6 * * *"),
    WARNING_DAYS: z
      .string()
      .default(DEFAULT_WARNING_DAYS.join(","))
      .transform((s) => s.split(",").map((d) => Number(d.trim())))
      .pipe(z.array(z.number().int().min(1).max(365)).min(1)),
    RUN_SCHEDULE: booleanText.default(true),
    // Service requests: business hours at the site before invited companies are reminded (machine down sooner), and
    // clock hours before an undecided request expires.
    SERVICE_REQUEST_REMINDER_HOURS: z.coerce.number().min(0.25).max(200).default(3),
    SERVICE_REQUEST_DOWN_REMINDER_HOURS: z.coerce.number().min(0.25).max(200).default(1),
    SERVICE_REQUEST_EXPIRY_HOURS: z.coerce
      .number()
      .min(1)
      .max(24 * 90)
      .default(72),
    // Minutes to wait before each retry of a failed scheduled run; one more attempt than there are delays.
    JOB_RETRY_MINUTES: z
      .string()
      .default("1,5,15")
      .transform((s) => s.split(",").map((d) => Number(d.trim())))
      .pipe(
        z
          .array(
            z
              .number()
              .min(0)
              .max(24 * 60),
          )
          .max(10),
      ),
    // Where stored files live: a local folder (one machine) or S3-compatible object storage (several machines).
    STORAGE_DRIVER: z.enum(["folder", "s3"]).default("folder"),
    S3_ENDPOINT: z.url().optional(),
    S3_BUCKET: z.string().min(3).max(63).optional(),
    S3_REGION: z.string().default("us-east-1"),
    S3_ACCESS_KEY_ID: z.string().optional(),
    S3_SECRET_ACCESS_KEY: z.string().optional(),
    S3_FORCE_PATH_STYLE: booleanText.default(false),
  })
  .superRefine((c, ctx) => {
    if (c.NODE_ENV === "production" && c.SESSION_SECRET === "clearbench-demo-secret-change-me") {
      ctx.addIssue({ code: "custom", path: ["SESSION_SECRET"], message: "set a real secret in production" });
    }
    if (c.NODE_ENV === "production" && !c.GATE_SECRET) {
      ctx.addIssue({
        code: "custom",
        path: ["GATE_SECRET"],
        message: "set a secret of 32+ characters in production",
      });
    }
    if (c.STORAGE_DRIVER === "s3" && !c.S3_BUCKET) {
      ctx.addIssue({ code: "custom", path: ["S3_BUCKET"], message: "required when STORAGE_DRIVER is s3" });
    }
  });

export type Config = Readonly<z.infer<typeof configSchema>>;

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
    throw new Error(`Invalid configuration: ${problems}`);
  }
  return Object.freeze(parsed.data);
}

/** The key that signs gate badges: the configured one, or for development and tests one derived from the session secret. */
export function gateSecret(config: Config): string {
  return (
    config.GATE_SECRET ?? createHmac("sha256", config.SESSION_SECRET).update("clearbench-gate").digest("hex")
  );
}

export function publicUrl(config: Config): string {
  return (
    config.PUBLIC_URL ?? `http://${config.HOST === "0.0.0.0" ? "localhost" : config.HOST}:${config.PORT}`
  );
}
