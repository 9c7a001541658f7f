import { loadConfig } from "./config.ts";
import { startServer } from "./main.ts";
import { log } from "./log.ts";

// Production entry: every service is configured from the environment (DATABASE_URL, SMTP_URL...).
const running = await startServer(loadConfig());
const stop = async (signal: string) => {
  log.info({ signal }, "stopping");
  await running.close().catch(() => undefined);
  process.exit(0);
};
process.on("SIGINT", () => void stop("SIGINT"));
process.on("SIGTERM", () => void stop("SIGTERM"));
