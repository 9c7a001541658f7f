import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE job_runs (
      id serial PRIMARY KEY,
      job varchar(40) NOT NULL,
      as_of timestamptz NOT NULL,
      started_at timestamptz NOT NULL,
      finished_at timestamptz NULL,
      counts jsonb NOT NULL DEFAULT '{}'::jsonb
    );
    -- Admins read the latest runs of each job.
    CREATE INDEX job_runs_job_idx ON job_runs (job, started_at DESC);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE job_runs");
}
