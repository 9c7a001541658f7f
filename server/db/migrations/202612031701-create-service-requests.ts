import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE service_requests (
      id serial PRIMARY KEY,
      shop_company_id integer NOT NULL REFERENCES companies(id),
      site_id integer NOT NULL REFERENCES sites(id),
      equipment_id integer NULL REFERENCES equipment(id),
      -- Null = the platform baseline.
      requirement_set_id integer NULL REFERENCES requirement_sets(id),
      kind varchar(24) NOT NULL CHECK (kind IN ('repair','preventive_maintenance','installation','parts_only')),
      machine_state varchar(16) NOT NULL CHECK (machine_state IN ('down','running_fault','planned')),
      timing varchar(8) NOT NULL CHECK (timing IN ('soonest','window')),
      window_start date NULL,
      window_end date NULL,
      technology varchar(40) NOT NULL,
      builder varchar(120) NULL,
      control_family varchar(120) NULL,
      problem text NOT NULL,
      status varchar(12) NOT NULL DEFAULT 'open' CHECK (status IN ('open','decided','cancelled','expired')),
      cancel_reason text NULL,
      accepted_estimate_id integer NULL,
      work_order_id integer NULL REFERENCES work_orders(id),
      created_by integer NOT NULL REFERENCES users(id),
      sent_at timestamptz NOT NULL,
      decided_at timestamptz NULL,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      CONSTRAINT service_requests_window CHECK (timing = 'soonest' OR (window_start IS NOT NULL AND window_end IS NOT NULL AND window_end >= window_start))
    );
    -- A shop lists its own requests, newest first.
    CREATE INDEX service_requests_shop_idx ON service_requests (shop_company_id, id DESC);
    -- The follow-up job scans only open requests.
    CREATE INDEX service_requests_open_idx ON service_requests (sent_at) WHERE status = 'open';
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE service_requests");
}
