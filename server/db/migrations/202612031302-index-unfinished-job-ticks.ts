import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  // The retry round each minute looks only at ticks still running or waiting for a retry; finished ticks (nearly all)
  // stay out of the index.
  await sequelize.query(
    "CREATE INDEX job_ticks_unfinished_idx ON job_ticks (job) WHERE status IN ('running', 'retrying')",
  );
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP INDEX job_ticks_unfinished_idx");
}
