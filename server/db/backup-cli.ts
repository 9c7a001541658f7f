import path from "node:path";
import { loadConfig } from "../config.ts";
import { backup, restore } from "./backup.ts";

// npm run db:backup [-- <folder>]   npm run db:restore -- <folder>
// Uses DATABASE_URL, or the embedded cluster of `npm start` when it is running.
const [command, folderArg] = process.argv.slice(2);
const config = loadConfig();
const databaseUrl = config.DATABASE_URL ?? `postgres://postgres@127.0.0.1:${config.PG_PORT}/clearbench`;
const say = (line: string) => process.stdout.write(`${line}\n`);

if (command === "backup") {
  const folder = path.resolve(
    folderArg ?? path.join(".backups", new Date().toISOString().replace(/[:.]/g, "-")),
  );
  const manifest = await backup(databaseUrl, config.UPLOADS_DIR, folder);
  say(
    `Backup written to ${folder}: ${Object.values(manifest.tables).reduce((a, b) => a + b, 0)} rows, ${Object.keys(manifest.files).length} files.`,
  );
} else if (command === "restore" && folderArg) {
  const result = await restore(databaseUrl, config.UPLOADS_DIR, path.resolve(folderArg));
  if (!result.ok) {
    say(`Restored with differences:\n${result.problems.join("\n")}`);
    process.exit(1);
  }
  say("Restored; row counts and file hashes match the backup.");
} else {
  say("usage: npm run db:backup [-- <folder>] | npm run db:restore -- <folder>");
  process.exit(2);
}
