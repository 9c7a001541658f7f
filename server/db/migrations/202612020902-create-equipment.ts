import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE equipment (
      id serial PRIMARY KEY,
      site_id integer NOT NULL REFERENCES sites(id),
      builder varchar(120) NOT NULL,
      control_family varchar(120) NOT NULL,
      technology varchar(40) NOT NULL,
      model varchar(120) NOT NULL,
      serial_number varchar(80) NULL,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- The machines of one site, listed on the site page and picked in the directory.
    CREATE INDEX equipment_site_idx ON equipment (site_id);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE equipment");
}
