import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE work_orders (
      id serial PRIMARY KEY,
      shop_company_id integer NOT NULL REFERENCES companies(id),
      site_id integer NOT NULL REFERENCES sites(id),
      equipment_id integer NULL REFERENCES equipment(id),
      technician_id integer NOT NULL REFERENCES technicians(id),
      service_company_id integer NOT NULL REFERENCES companies(id),
      -- Null = raised against the platform baseline only.
      requirement_set_id integer NULL REFERENCES requirement_sets(id),
      technology varchar(40) NOT NULL,
      problem text NOT NULL,
      urgency varchar(8) NOT NULL CHECK (urgency IN ('low','normal','high','down')),
      preferred_dates jsonb NOT NULL DEFAULT '[]'::jsonb,
      status varchar(12) NOT NULL DEFAULT 'requested'
        CHECK (status IN ('requested','accepted','declined','completed','confirmed')),
      decline_reason text NULL,
      hours_worked numeric(6,2) NULL CHECK (hours_worked >= 0),
      travel_hours numeric(6,2) NULL CHECK (travel_hours >= 0),
      completion_note text NULL,
      -- Proof of standing when the technician took the job and when the work was done.
      snapshot_accepted jsonb NULL,
      snapshot_completed jsonb NULL,
      created_by integer NOT NULL REFERENCES users(id),
      accepted_at timestamptz NULL,
      declined_at timestamptz NULL,
      completed_at timestamptz NULL,
      confirmed_at timestamptz NULL,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- Each side lists its own work orders by status, newest first.
    CREATE INDEX work_orders_shop_idx ON work_orders (shop_company_id, status, created_at DESC);
    CREATE INDEX work_orders_service_idx ON work_orders (service_company_id, status, created_at DESC);
    CREATE INDEX work_orders_technician_idx ON work_orders (technician_id, status, created_at DESC);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE work_orders");
}
