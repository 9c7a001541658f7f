import { loadConfig } from "../config.ts";
import { connectDatabase } from "./sequelize.ts";
import { migrate, makeUmzug } from "./migrate.ts";
import { log } from "../log.ts";

// npm run migrate [-- down]: needs DATABASE_URL (npm start migrates its own embedded cluster by itself).
const config = loadConfig();
if (!config.DATABASE_URL) {
  log.error("Set DATABASE_URL; npm start migrates its own embedded database by itself");
  process.exit(2);
}
const sequelize = connectDatabase(config.DATABASE_URL);
if (process.argv[2] === "down") {
  await makeUmzug(sequelize).down();
} else {
  const names = await migrate(sequelize);
  log.info({ applied: names }, "migrations applied");
}
await sequelize.close();
