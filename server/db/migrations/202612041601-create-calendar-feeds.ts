import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE calendar_feeds (
      company_id integer PRIMARY KEY REFERENCES companies(id),
      -- Only the digest of the secret in the feed's address is kept, like a password.
      secret_sha256 char(64) NOT NULL UNIQUE,
      created_by integer NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE calendar_feeds");
}
