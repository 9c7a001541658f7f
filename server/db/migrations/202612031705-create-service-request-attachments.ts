import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE service_request_attachments (
      id serial PRIMARY KEY,
      request_id integer NOT NULL REFERENCES service_requests(id),
      -- The document belongs to the shop that raised the request.
      document_id integer NOT NULL REFERENCES documents(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- A request's attachments in the order they were added.
    CREATE INDEX service_request_attachments_request_idx ON service_request_attachments (request_id, id);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE service_request_attachments");
}
