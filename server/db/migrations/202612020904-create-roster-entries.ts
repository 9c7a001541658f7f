import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE roster_entries (
      id serial PRIMARY KEY,
      shop_company_id integer NOT NULL REFERENCES companies(id),
      -- Exactly one of the two: a single technician, or a whole service company (all its technicians).
      technician_id integer NULL REFERENCES technicians(id),
      service_company_id integer NULL REFERENCES companies(id),
      added_by integer NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      CONSTRAINT roster_entries_one_subject CHECK ((technician_id IS NULL) <> (service_company_id IS NULL))
    );
    -- Each technician or company appears once on a shop's roster; these also serve the shop's own list.
    CREATE UNIQUE INDEX roster_entries_technician_key ON roster_entries (shop_company_id, technician_id) WHERE technician_id IS NOT NULL;
    CREATE UNIQUE INDEX roster_entries_company_key ON roster_entries (shop_company_id, service_company_id) WHERE service_company_id IS NOT NULL;
    -- Roster alerts go from a changed technician (or its company) to the shops that roster it.
    CREATE INDEX roster_entries_by_technician_idx ON roster_entries (technician_id) WHERE technician_id IS NOT NULL;
    CREATE INDEX roster_entries_by_company_idx ON roster_entries (service_company_id) WHERE service_company_id IS NOT NULL;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE roster_entries");
}
