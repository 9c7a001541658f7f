import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE service_request_estimates (
      id serial PRIMARY KEY,
      request_id integer NOT NULL REFERENCES service_requests(id),
      company_id integer NOT NULL REFERENCES companies(id),
      status varchar(12) NOT NULL DEFAULT 'active' CHECK (status IN ('active','withdrawn','accepted','not_chosen')),
      revision integer NOT NULL DEFAULT 1,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- One estimate per company and request (revisions are rows of their own); also serves the comparison.
    CREATE UNIQUE INDEX service_request_estimates_key ON service_request_estimates (request_id, company_id);
    -- Accepted-estimate counts per company.
    CREATE INDEX service_request_estimates_company_idx ON service_request_estimates (company_id, status);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE service_request_estimates");
}
