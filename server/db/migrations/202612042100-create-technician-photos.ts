import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  // Kept in the row, not in file storage: at most 512 px re-encoded, a few tens of kilobytes, one per technician.
  await sequelize.query(`
    CREATE TABLE technician_photos (
      technician_id integer PRIMARY KEY REFERENCES technicians(id) ON DELETE CASCADE,
      jpeg bytea NOT NULL,
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE technician_photos");
}
