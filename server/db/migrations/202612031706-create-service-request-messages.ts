import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE service_request_messages (
      id serial PRIMARY KEY,
      request_id integer NOT NULL REFERENCES service_requests(id),
      -- The thread is between the shop and this one company; no other company sees it.
      company_id integer NOT NULL REFERENCES companies(id),
      author_user_id integer NOT NULL REFERENCES users(id),
      side varchar(8) NOT NULL CHECK (side IN ('shop','service')),
      body text NOT NULL,
      document_id integer NULL REFERENCES documents(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- One thread, in order.
    CREATE INDEX service_request_messages_thread_idx ON service_request_messages (request_id, company_id, id);
    CREATE FUNCTION service_request_messages_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'service_request_messages is append-only'; END $$;
    CREATE TRIGGER service_request_messages_no_change BEFORE UPDATE OR DELETE ON service_request_messages
      FOR EACH ROW EXECUTE FUNCTION service_request_messages_append_only();
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE service_request_messages");
  await sequelize.query("DROP FUNCTION IF EXISTS service_request_messages_append_only()");
}
