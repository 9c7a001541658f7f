import type { Server } from "node:http";
import pg from "pg";
import type { Config } from "./config.ts";
import { configureLog, log } from "./log.ts";
import { connectDatabase } from "./db/sequelize.ts";
import { closeReplica, connectReplica } from "./db/replica.ts";
import { initModels } from "./db/associations.ts";
import { migrate } from "./db/migrate.ts";
import { createApp } from "./app.ts";
import { readinessOf } from "./health/readiness.ts";
import { setHashConcurrency, setPasswordCost } from "./accounts/index.ts";
import { createSmtpMailer, deliverDueMail } from "./mail/index.ts";
import { sweepOrphans } from "./storage/sweep-orphans.ts";
import { startSchedule } from "../jobs/schedule.ts";
import type { FileStorage } from "./storage/index.ts";

export interface RunningServer {
  server: Server;
  port: number;
  close(): Promise<void>;
}

/**
 * Connects, migrates, listens, runs `prepare` (e.g. loading the demo scenario) and starts the background senders;
 * resolves once the instance is ready. Between listening and ready, the liveness check answers and everything else
 * answers 503, so nothing is announced before it can be served.
 */
export async function startServer(
  config: Config,
  options: { clientDir?: string; prepare?: () => Promise<void>; onListening?: (port: number) => void } = {},
): Promise<RunningServer> {
  if (!config.DATABASE_URL) throw new Error("DATABASE_URL is required to start the server");
  configureLog(config.LOG_LEVEL);
  setPasswordCost(config.BCRYPT_COST);
  setHashConcurrency(config.HASH_CONCURRENCY, config.HASH_QUEUE);
  const sequelize = connectDatabase(config.DATABASE_URL);
  initModels(sequelize);
  await migrate(sequelize);
  if (config.DATABASE_REPLICA_URL) connectReplica(config.DATABASE_REPLICA_URL);
  const sessionPool = new pg.Pool({
    connectionString: config.DATABASE_URL,
    max: 5,
    connectionTimeoutMillis: 3_000,
  });
  sessionPool.on("error", (err) => log.warn({ err }, "session pool error"));
  const app = createApp({ config, sessionPool, clientDir: options.clientDir });
  const starting = readinessOf(app).hold("starting up");
  const swept = await sweepOrphans(app.locals.storage as FileStorage);
  if (Object.values(swept).some((n) => n > 0)) log.warn({ swept }, "start-up sweep repaired stored files");

  const mailer = config.SMTP_URL ? createSmtpMailer(config.SMTP_URL) : undefined;
  const sendMail = async () => {
    if (!mailer) return;
    try {
      await deliverDueMail(mailer, config.MAIL_FROM);
    } catch (err) {
      log.warn({ err }, "outbox delivery round failed");
    }
  };
  // Mail goes out right after the request that queued it; the schedule retries what failed.
  app.locals.kickOutbox = () => void sendMail();
  const schedule = config.RUN_SCHEDULE
    ? startSchedule(config, { mailer, storage: app.locals.storage as FileStorage })
    : undefined;

  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
    s.once("error", reject);
  });
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : config.PORT;
  log.info({ port }, "server listening");
  options.onListening?.(port);
  try {
    await options.prepare?.();
  } catch (err) {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    throw err;
  }
  starting();
  log.info({ port }, "server ready");

  return {
    server,
    port,
    async close() {
      await schedule?.stop();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      mailer?.close();
      await sessionPool.end();
      await closeReplica();
      await sequelize.close();
    },
  };
}
