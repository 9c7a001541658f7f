import type { MigrationContext } from "../migrate.ts";

// Work a shop records on its own machine (before the platform, or by someone not on it). No technician or service
// company id on purpose: such an entry can never reach a rating.
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE machine_shop_records (
      id serial PRIMARY KEY,
      equipment_id integer NOT NULL REFERENCES equipment(id),
      shop_company_id integer NOT NULL REFERENCES companies(id),
      performed_on date NOT NULL,
      work_kind varchar(24) NOT NULL
        CHECK (work_kind IN ('repair','preventive_maintenance','installation','parts_only')),
      problem_area varchar(24) NULL,
      service_company_name varchar(160) NULL,
      technician_name varchar(160) NULL,
      hours_on_site numeric(6,2) NULL,
      travel_hours numeric(6,2) NULL,
      note text NOT NULL,
      parts_used jsonb NOT NULL DEFAULT '[]'::jsonb,
      recorded_by integer NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- A machine's history is read by machine, in date order.
    CREATE INDEX machine_shop_records_equipment_idx ON machine_shop_records (equipment_id, performed_on);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE machine_shop_records");
}
