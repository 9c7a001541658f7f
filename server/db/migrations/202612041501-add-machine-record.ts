import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    ALTER TABLE equipment
      ADD COLUMN year_built smallint NULL CHECK (year_built BETWEEN 1900 AND 2100),
      ADD COLUMN in_service_on date NULL,
      ADD COLUMN building varchar(80) NULL,
      ADD COLUMN bay varchar(40) NULL,
      ADD COLUMN notes text NULL,
      ADD COLUMN state varchar(16) NOT NULL DEFAULT 'running'
        CHECK (state IN ('running','down','out_of_service','sold'));
    -- Looks a serial number up by its builder without regard to case or spacing (platform-wide uniqueness check).
    CREATE INDEX equipment_builder_serial_idx
      ON equipment (lower(regexp_replace(btrim(builder), '\\s+', ' ', 'g')), upper(btrim(serial_number)))
      WHERE serial_number IS NOT NULL;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    DROP INDEX equipment_builder_serial_idx;
    ALTER TABLE equipment DROP COLUMN year_built, DROP COLUMN in_service_on, DROP COLUMN building,
      DROP COLUMN bay, DROP COLUMN notes, DROP COLUMN state;
  `);
}
