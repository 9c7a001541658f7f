import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE machine_hour_readings (
      id serial PRIMARY KEY,
      equipment_id integer NOT NULL REFERENCES equipment(id) ON DELETE CASCADE,
      hours integer NOT NULL CHECK (hours >= 0),
      -- The calendar date at the machine's site when the meter was read.
      read_on date NOT NULL,
      recorded_by integer NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- The latest reading of a machine and the readings of its last year, for the projected due date.
    CREATE INDEX machine_hour_readings_by_equipment_idx ON machine_hour_readings (equipment_id, read_on DESC, id DESC);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE machine_hour_readings");
}
