import type { MigrationContext } from "../migrate.ts";

// What a machine's service history reads from a work order beyond its note and hours: the kind of work, where on the
// machine the trouble was (repeat faults are matched on it) and the parts the technician fitted.
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    ALTER TABLE work_orders
      ADD COLUMN work_kind varchar(24) NULL
        CHECK (work_kind IN ('repair','preventive_maintenance','installation','parts_only')),
      ADD COLUMN problem_area varchar(24) NULL,
      ADD COLUMN parts_used jsonb NOT NULL DEFAULT '[]'::jsonb;
    -- A machine's history lists its confirmed work orders.
    CREATE INDEX work_orders_equipment_idx ON work_orders (equipment_id) WHERE equipment_id IS NOT NULL;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    DROP INDEX work_orders_equipment_idx;
    ALTER TABLE work_orders DROP COLUMN work_kind, DROP COLUMN problem_area, DROP COLUMN parts_used;
  `);
}
