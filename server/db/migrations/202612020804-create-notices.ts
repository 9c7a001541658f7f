import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE notices (
      id serial PRIMARY KEY,
      credential_id integer NOT NULL REFERENCES credentials(id),
      -- Days before the lapse; 0 = the lapse itself.
      threshold_days integer NOT NULL CHECK (threshold_days >= 0),
      lapses_at timestamptz NOT NULL,
      job_run_id integer NULL REFERENCES job_runs(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      -- One notice per credential per threshold, enforced by the database so reruns and parallel runs send nothing twice.
      CONSTRAINT notices_once_per_threshold UNIQUE (credential_id, threshold_days)
    );
    CREATE INDEX notices_job_run_idx ON notices (job_run_id);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE notices");
}
