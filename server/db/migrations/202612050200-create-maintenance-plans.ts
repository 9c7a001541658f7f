import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE maintenance_plans (
      id serial PRIMARY KEY,
      -- A machine removed from its site takes its plans with it; the audit trail keeps what they were.
      equipment_id integer NOT NULL REFERENCES equipment(id) ON DELETE CASCADE,
      name varchar(160) NOT NULL,
      interval_kind varchar(8) NOT NULL CHECK (interval_kind IN ('months', 'hours')),
      interval_months smallint NULL CHECK (interval_months BETWEEN 1 AND 120),
      interval_hours integer NULL CHECK (interval_hours BETWEEN 1 AND 100000),
      last_done_on date NULL,
      last_done_hours integer NULL CHECK (last_done_hours >= 0),
      created_by integer NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      CONSTRAINT maintenance_plans_interval_fits_kind CHECK (
        (interval_kind = 'months' AND interval_months IS NOT NULL AND interval_hours IS NULL AND last_done_on IS NOT NULL)
        OR (interval_kind = 'hours' AND interval_hours IS NOT NULL AND interval_months IS NULL AND last_done_hours IS NOT NULL))
    );
    -- The machine page lists a machine's plans.
    CREATE INDEX maintenance_plans_by_equipment_idx ON maintenance_plans (equipment_id);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE maintenance_plans");
}
