import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  // The periods a machine stood down: opened by hand, by a service request or work order raised for a machine that is
  // down, and closed by hand or when the shop confirms the work that brought it back. Kept as rows rather than read
  // back from the audit trail, so a year's chart is one range query.
  await sequelize.query(`
    CREATE TABLE machine_downtime (
      id serial PRIMARY KEY,
      equipment_id integer NOT NULL REFERENCES equipment(id) ON DELETE CASCADE,
      started_at timestamptz NOT NULL,
      ended_at timestamptz NULL,
      opened_by varchar(16) NOT NULL CHECK (opened_by IN ('hand','service_request','work_order')),
      opened_by_user_id integer NULL REFERENCES users(id),
      service_request_id integer NULL REFERENCES service_requests(id) ON DELETE SET NULL,
      work_order_id integer NULL REFERENCES work_orders(id) ON DELETE SET NULL,
      closed_by varchar(16) NULL CHECK (closed_by IN ('hand','confirmation')),
      closed_by_user_id integer NULL REFERENCES users(id),
      closed_work_order_id integer NULL REFERENCES work_orders(id) ON DELETE SET NULL,
      CHECK (ended_at IS NULL OR ended_at >= started_at),
      CHECK ((ended_at IS NULL) = (closed_by IS NULL))
    );
    -- A machine is down once at a time: at most one open period per machine, whoever opens it.
    CREATE UNIQUE INDEX machine_downtime_open_idx ON machine_downtime (equipment_id) WHERE ended_at IS NULL;
    -- One machine's periods in order, for the year's chart.
    CREATE INDEX machine_downtime_equipment_idx ON machine_downtime (equipment_id, started_at);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE machine_downtime");
}
