import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE maintenance_reminders (
      id serial PRIMARY KEY,
      plan_id integer NOT NULL REFERENCES maintenance_plans(id) ON DELETE CASCADE,
      -- One due occurrence ('date:2027-03-31' or 'hours:10500'): after the work the plan's next one starts afresh.
      due_key varchar(40) NOT NULL,
      threshold_days smallint NOT NULL,
      due_on date NULL,
      job_run_id integer NULL REFERENCES job_runs(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      -- Once per plan, occurrence and threshold, whatever the number of job processes or reruns.
      CONSTRAINT maintenance_reminders_once UNIQUE (plan_id, due_key, threshold_days)
    );
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE maintenance_reminders");
}
