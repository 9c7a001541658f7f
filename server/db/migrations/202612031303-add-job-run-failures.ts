import type { MigrationContext } from "../migrate.ts";

/** A run that failed is recorded too: which attempt of its tick it was and what went wrong. */
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    ALTER TABLE job_runs
      ADD COLUMN attempt integer NOT NULL DEFAULT 1,
      ADD COLUMN error text NULL
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("ALTER TABLE job_runs DROP COLUMN attempt, DROP COLUMN error");
}
