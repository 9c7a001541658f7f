import type { MigrationContext } from "../migrate.ts";

/** A run an admin started by hand names that admin; a scheduled run leaves it empty. */
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query("ALTER TABLE job_runs ADD COLUMN started_by integer NULL REFERENCES users(id)");
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("ALTER TABLE job_runs DROP COLUMN started_by");
}
