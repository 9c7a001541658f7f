import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  // Kept in the row, not in file storage: at most 240 px re-encoded, a few kilobytes, one per image attachment.
  await sequelize.query(`
    CREATE TABLE attachment_thumbnails (
      document_id integer PRIMARY KEY REFERENCES documents(id) ON DELETE CASCADE,
      jpeg bytea NOT NULL,
      width integer NOT NULL,
      height integer NOT NULL,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE attachment_thumbnails");
}
