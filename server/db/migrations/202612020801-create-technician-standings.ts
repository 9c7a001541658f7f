import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE technician_standings (
      id serial PRIMARY KEY,
      technician_id integer NOT NULL REFERENCES technicians(id),
      -- Null = the platform baseline.
      requirement_set_id integer NULL REFERENCES requirement_sets(id),
      standing varchar(12) NOT NULL CHECK (standing IN ('cleared','lapsing','not_cleared')),
      earliest_lapse timestamptz NULL,
      results jsonb NOT NULL,
      computed_at timestamptz NOT NULL
    );
    -- One row per technician and set; the baseline (null set) is keyed as set 0 so upserts can target it.
    CREATE UNIQUE INDEX technician_standings_key ON technician_standings (technician_id, (coalesce(requirement_set_id, 0)));
    -- The directory filters technicians by their standing against one set (or the baseline).
    CREATE INDEX technician_standings_set_idx ON technician_standings (requirement_set_id, standing);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE technician_standings");
}
