import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE reviewer_digests (
      id serial PRIMARY KEY,
      user_id integer NOT NULL REFERENCES users(id),
      digest_date date NOT NULL,
      queue_count integer NOT NULL,
      oldest_submitted_at timestamptz NOT NULL,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      -- At most one digest per reviewer per day, whatever runs the job.
      CONSTRAINT reviewer_digests_once_a_day UNIQUE (user_id, digest_date)
    )
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE reviewer_digests");
}
