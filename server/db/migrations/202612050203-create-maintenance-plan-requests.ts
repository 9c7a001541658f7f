import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE maintenance_plan_requests (
      id serial PRIMARY KEY,
      plan_id integer NOT NULL REFERENCES maintenance_plans(id) ON DELETE CASCADE,
      -- Each service request serves at most one plan; its confirmed work order moves that plan on.
      service_request_id integer NOT NULL UNIQUE REFERENCES service_requests(id),
      due_key varchar(40) NOT NULL,
      window_start date NOT NULL,
      window_end date NOT NULL,
      -- Set once the resulting work order is confirmed and the plan has moved to its next due date.
      done_work_order_id integer NULL REFERENCES work_orders(id),
      done_on date NULL,
      created_by integer NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- The panel shows each plan's open request.
    CREATE INDEX maintenance_plan_requests_by_plan_idx ON maintenance_plan_requests (plan_id, created_at DESC);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE maintenance_plan_requests");
}
