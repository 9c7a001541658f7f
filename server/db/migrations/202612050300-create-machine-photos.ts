import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  // Kept in the row like the badge photo: re-encoded at most 1600 px, a few hundred kilobytes, so a photo moves with
  // its machine in the same transaction as a transfer and nothing on disk can be left behind by a failed upload.
  await sequelize.query(`
    CREATE TABLE machine_photos (
      id serial PRIMARY KEY,
      equipment_id integer NOT NULL REFERENCES equipment(id) ON DELETE CASCADE,
      jpeg bytea NOT NULL,
      width smallint NOT NULL,
      height smallint NOT NULL,
      caption varchar(200) NULL,
      uploaded_by integer NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- The photos of one machine, oldest first, for its page.
    CREATE INDEX machine_photos_equipment_idx ON machine_photos (equipment_id, id);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE machine_photos");
}
