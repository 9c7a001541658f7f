import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE work_order_messages (
      id serial PRIMARY KEY,
      work_order_id integer NOT NULL REFERENCES work_orders(id),
      author_user_id integer NOT NULL REFERENCES users(id),
      side varchar(8) NOT NULL CHECK (side IN ('shop','service')),
      body text NOT NULL,
      -- The attachment belongs to the sender's company, like every document.
      document_id integer NULL REFERENCES documents(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    CREATE INDEX work_order_messages_thread_idx ON work_order_messages (work_order_id, id);
    -- Append-only: the thread is the record of who said what, so the database refuses edits and deletions.
    CREATE FUNCTION work_order_messages_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'work_order_messages is append-only'; END $$;
    CREATE TRIGGER work_order_messages_no_change BEFORE UPDATE OR DELETE ON work_order_messages
      FOR EACH ROW EXECUTE FUNCTION work_order_messages_append_only();
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE work_order_messages");
  await sequelize.query("DROP FUNCTION IF EXISTS work_order_messages_append_only()");
}
