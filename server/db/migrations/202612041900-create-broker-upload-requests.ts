import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE broker_contacts (
      id serial PRIMARY KEY,
      company_id integer NOT NULL REFERENCES companies(id),
      -- Null: the company's broker for every coverage; a type code: that coverage's own broker.
      type_code varchar(40) REFERENCES credential_types(code),
      agency varchar(160) NOT NULL,
      contact_name varchar(160) NOT NULL,
      email varchar(254) NOT NULL,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    CREATE UNIQUE INDEX broker_contacts_company_default_idx ON broker_contacts (company_id) WHERE type_code IS NULL;
    CREATE UNIQUE INDEX broker_contacts_company_type_idx ON broker_contacts (company_id, type_code)
      WHERE type_code IS NOT NULL;

    CREATE TABLE broker_upload_requests (
      id serial PRIMARY KEY,
      company_id integer NOT NULL REFERENCES companies(id),
      type_code varchar(40) NOT NULL REFERENCES credential_types(code),
      -- The lapsing coverage the request renews, when it came from one.
      credential_id integer REFERENCES credentials(id),
      -- The shop to be named as certificate holder, told when the certificate is verified.
      shop_company_id integer REFERENCES companies(id),
      agency varchar(160) NOT NULL,
      contact_name varchar(160) NOT NULL,
      broker_email varchar(254) NOT NULL,
      -- Only the digest: a copy of the table does not hand out working links.
      token_sha256 char(64) NOT NULL UNIQUE,
      expires_at timestamptz NOT NULL,
      used_at timestamptz,
      document_id integer REFERENCES documents(id),
      shop_told_at timestamptz,
      requested_by integer NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    CREATE INDEX broker_upload_requests_company_idx ON broker_upload_requests (company_id, id);
    CREATE INDEX broker_upload_requests_document_idx ON broker_upload_requests (document_id)
      WHERE document_id IS NOT NULL;

    CREATE TABLE broker_request_reminders (
      id serial PRIMARY KEY,
      request_id integer NOT NULL REFERENCES broker_upload_requests(id),
      days_before integer NOT NULL,
      sent_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      -- Once per threshold, however often the job runs.
      UNIQUE (request_id, days_before)
    );
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(
    "DROP TABLE broker_request_reminders; DROP TABLE broker_upload_requests; DROP TABLE broker_contacts",
  );
}
