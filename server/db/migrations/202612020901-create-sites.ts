import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE sites (
      id serial PRIMARY KEY,
      company_id integer NOT NULL REFERENCES companies(id),
      name varchar(160) NOT NULL,
      address_line varchar(200) NOT NULL,
      postal_code varchar(10) NOT NULL,
      -- IANA zone of the site, suggested from the postal code and editable by the buyer.
      time_zone varchar(64) NOT NULL,
      -- Centroid of the postal code (offline dataset), the origin of every distance to this site.
      latitude double precision NOT NULL,
      longitude double precision NOT NULL,
      -- A site is archived, never deleted: work orders and requirement sets keep pointing at it.
      active boolean NOT NULL DEFAULT true,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- A buyer lists the sites of their own shop.
    CREATE INDEX sites_company_idx ON sites (company_id);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE sites");
}
