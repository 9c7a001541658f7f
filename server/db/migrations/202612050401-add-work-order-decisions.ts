import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    ALTER TABLE work_orders DROP CONSTRAINT work_orders_status_check;
    ALTER TABLE work_orders
      ADD CONSTRAINT work_orders_status_check
        CHECK (status IN ('requested','accepted','declined','completed','disputed','confirmed','cancelled')),
      ADD COLUMN arrival_at timestamptz NULL,
      ADD COLUMN proposed_date date NULL,
      ADD COLUMN cancel_reason text NULL,
      ADD COLUMN dispute_reason text NULL,
      ADD COLUMN cancelled_at timestamptz NULL,
      ADD COLUMN disputed_at timestamptz NULL,
      ADD COLUMN copied_from_id integer NULL REFERENCES work_orders(id);
    -- The shop's page of a declined work order lists the copies sent to other technicians.
    CREATE INDEX work_orders_copied_from_idx ON work_orders (copied_from_id) WHERE copied_from_id IS NOT NULL;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    DROP INDEX work_orders_copied_from_idx;
    UPDATE work_orders SET status = 'completed' WHERE status = 'disputed';
    UPDATE work_orders SET status = 'declined' WHERE status = 'cancelled';
    ALTER TABLE work_orders DROP CONSTRAINT work_orders_status_check;
    ALTER TABLE work_orders
      ADD CONSTRAINT work_orders_status_check
        CHECK (status IN ('requested','accepted','declined','completed','confirmed')),
      DROP COLUMN arrival_at, DROP COLUMN proposed_date, DROP COLUMN cancel_reason, DROP COLUMN dispute_reason,
      DROP COLUMN cancelled_at, DROP COLUMN disputed_at, DROP COLUMN copied_from_id;
  `);
}
