import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE roster_alerts (
      id serial PRIMARY KEY,
      shop_company_id integer NOT NULL REFERENCES companies(id),
      technician_id integer NOT NULL REFERENCES technicians(id),
      event varchar(40) NOT NULL CHECK (event IN ('stopped_clearing','lapse_within_30_days')),
      -- Tells one occurrence of the event from the next, e.g. the lapse instant; the key makes the alert idempotent.
      event_key varchar(300) NOT NULL,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- Once per shop, technician and event: a second delivery of the same change inserts nothing (ON CONFLICT DO NOTHING).
    CREATE UNIQUE INDEX roster_alerts_once_key ON roster_alerts (shop_company_id, technician_id, event, event_key);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE roster_alerts");
}
