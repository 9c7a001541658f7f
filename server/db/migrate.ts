import { readdirSync } from "node:fs";
import path from "node:path";
import { Umzug, SequelizeStorage } from "umzug";
import type { QueryInterface, Sequelize } from "sequelize";

const MIGRATIONS_DIR = path.join(import.meta.dirname, "migrations");

export type MigrationContext = { queryInterface: QueryInterface; sequelize: Sequelize };
type MigrationModule = {
  up: (ctx: MigrationContext) => Promise<void>;
  down?: (ctx: MigrationContext) => Promise<void>;
};

// Migrations are imported by our own code rather than umzug's glob import, so tsx and Vitest both load .ts files.
export function makeUmzug(sequelize: Sequelize) {
  const files = readdirSync(MIGRATIONS_DIR)
    .filter((f) => /^\d{12}-[a-z0-9-]+\.ts$/.test(f))
    .sort();
  return new Umzug<MigrationContext>({
    migrations: files.map((file) => {
      const load = async () => (await import(path.join(MIGRATIONS_DIR, file))) as MigrationModule;
      return {
        name: file.replace(/\.ts$/, ""),
        up: async ({ context }) => (await load()).up(context),
        down: async ({ context }) => {
          const m = await load();
          if (!m.down) throw new Error(`${file} cannot be reversed`);
          await m.down(context);
        },
      };
    }),
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: "schema_migrations" }),
    logger: undefined,
  });
}

export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const done = await makeUmzug(sequelize).up();
  return done.map((m) => m.name);
}
