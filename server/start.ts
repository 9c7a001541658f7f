import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import { loadConfig, publicUrl } from "./config.ts";
import { startEmbeddedPostgres, type EmbeddedPostgres } from "./db/embedded-postgres.ts";
import { startSmtpCatcher, type SmtpCatcher } from "./mail/smtp-catcher.ts";
import { CaughtMail } from "./db/models.ts";
import { startServer, type RunningServer } from "./main.ts";
import { loadDemoScenarioOnce, DEMO_PASSWORD, demoSignIns } from "./db/demo-scenario/index.ts";
import { log } from "./log.ts";
import { ensureDebianTools, OCR_TOOLS } from "./system/debian-packages.ts";

// `npm start`: everything the demo needs on one machine, on the embedded defaults.
const root = path.resolve(import.meta.dirname, "..");
const say = (line: string) => process.stdout.write(`${line}\n`);
const env = { ...process.env };
let postgres: EmbeddedPostgres | undefined;
let catcher: SmtpCatcher | undefined;

const base = loadConfig(env);
if (!base.DATABASE_URL) {
  postgres = await startEmbeddedPostgres({
    root: path.join(root, ".pg"),
    port: base.PG_PORT,
    database: "clearbench",
    say,
  });
  env.DATABASE_URL = postgres.url;
  say(`PostgreSQL of the project's own: 127.0.0.1:${postgres.port}`);
}
const stopPostgres = () => {
  postgres?.stop();
  postgres = undefined;
};
process.on("exit", stopPostgres);

// Ctrl-C at any moment, even while starting, stops what this command started.
let running: RunningServer | undefined = undefined;
let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  log.info({ signal }, "stopping");
  await running?.close().catch(() => undefined);
  await catcher?.close().catch(() => undefined);
  stopPostgres();
  process.exit(0);
}
process.on("SIGINT", () => void shutdown("SIGINT"));
process.on("SIGTERM", () => void shutdown("SIGTERM"));

if (!base.SMTP_URL) {
  catcher = await startSmtpCatcher(async (m) => {
    await CaughtMail.create({
      fromAddress: m.from,
      toAddress: m.to,
      subject: m.subject,
      textBody: m.text,
      htmlBody: m.html,
    });
  }, base.SMTP_CATCHER_PORT);
  env.SMTP_URL = catcher.url;
  say(`Local mail catcher (development): ${catcher.url}; read caught mail at Admin > Outbox`);
}

const withoutOcr = ensureDebianTools(OCR_TOOLS, say);
if (withoutOcr.length)
  say(`OCR is off (missing ${withoutOcr.join(", ")}): fields of images and scans are typed by hand.`);

if (!existsSync(path.join(root, "dist", "index.html"))) {
  say("Building the client (first run)...");
  const built = spawnSync(path.join(root, "node_modules", ".bin", "vite"), ["build"], {
    cwd: root,
    stdio: "inherit",
  });
  if (built.status !== 0) throw new Error("vite build failed");
}

const config = loadConfig(env);
// The URL is printed only once the demo scenario is in: until then the server answers 503 "starting".
running = await startServer(config, {
  prepare: async () => {
    const loaded = await loadDemoScenarioOnce({ uploadsDir: config.UPLOADS_DIR, today: new Date() });
    if (loaded) say("Demo scenario loaded.");
  },
});

say(`\nClearbench is running at ${publicUrl({ ...config, PORT: running.port })}`);
say(`Demo sign-ins (password for all: ${DEMO_PASSWORD}):`);
for (const s of demoSignIns) say(`  ${s.role.padEnd(15)} ${s.email.padEnd(34)} ${s.company}`);
say("Press Ctrl-C to stop.");
