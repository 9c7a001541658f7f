import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE gate_checks (
      id serial PRIMARY KEY,
      technician_id integer NOT NULL REFERENCES technicians(id),
      service_company_id integer NOT NULL REFERENCES companies(id),
      -- Null when the badge was scanned without a site's gate code.
      site_id integer NULL REFERENCES sites(id),
      shop_company_id integer NULL REFERENCES companies(id),
      state varchar(16) NOT NULL,
      checked_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    CREATE INDEX gate_checks_by_service_company_idx ON gate_checks (service_company_id, checked_at DESC);
    CREATE INDEX gate_checks_by_shop_idx ON gate_checks (shop_company_id, checked_at DESC) WHERE shop_company_id IS NOT NULL;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE gate_checks");
}
