import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE service_request_events (
      id serial PRIMARY KEY,
      request_id integer NOT NULL REFERENCES service_requests(id),
      -- Null = the scheduled job.
      actor_user_id integer NULL REFERENCES users(id),
      kind varchar(32) NOT NULL,
      -- Set for reminders: the number of business hours after which it went out.
      threshold_hours numeric(6,2) NULL,
      note text NULL,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- The request's timeline, in order.
    CREATE INDEX service_request_events_request_idx ON service_request_events (request_id, id);
    -- Each reminder once per request and threshold, whichever instance of the job gets there first.
    CREATE UNIQUE INDEX service_request_events_reminder_key ON service_request_events (request_id, threshold_hours)
      WHERE kind = 'reminder_sent';
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE service_request_events");
}
