import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE notifications (
      id serial PRIMARY KEY,
      user_id integer NOT NULL REFERENCES users(id),
      kind varchar(40) NOT NULL,
      title varchar(300) NOT NULL,
      body text NOT NULL,
      link varchar(500) NULL,
      notice_id integer NULL REFERENCES notices(id),
      read_at timestamptz NULL,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- A user's list, newest first, and the unread badge count.
    CREATE INDEX notifications_user_idx ON notifications (user_id, created_at DESC);
    CREATE INDEX notifications_unread_idx ON notifications (user_id) WHERE read_at IS NULL;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE notifications");
}
