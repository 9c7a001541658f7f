import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE service_request_invitations (
      id serial PRIMARY KEY,
      request_id integer NOT NULL REFERENCES service_requests(id),
      company_id integer NOT NULL REFERENCES companies(id),
      -- 'routing' = found by the routing rules; 'buyer' = added by the buyer from the roster.
      source varchar(8) NOT NULL CHECK (source IN ('routing','buyer')),
      invited_at timestamptz NOT NULL,
      first_answer_at timestamptz NULL,
      answer varchar(8) NULL CHECK (answer IN ('estimate','pass')),
      pass_reason text NULL
    );
    -- One invitation per company and request; also finds a company's invitation to one request.
    CREATE UNIQUE INDEX service_request_invitations_key ON service_request_invitations (request_id, company_id);
    -- A company's inbox, and its response times over the last 90 days.
    CREATE INDEX service_request_invitations_company_idx ON service_request_invitations (company_id, invited_at DESC);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE service_request_invitations");
}
