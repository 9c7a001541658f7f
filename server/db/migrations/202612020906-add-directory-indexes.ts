import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- Every directory search starts from the technicians whose baseline standing lists them; this partial index holds
    -- just those rows, so the planner reads the listable population without touching not-cleared or per-set rows.
    CREATE INDEX technician_standings_listable_idx ON technician_standings (technician_id)
      WHERE requirement_set_id IS NULL AND standing IN ('cleared','lapsing');
    -- The bounding-box prefilter of a radius search (latitude BETWEEN .. AND longitude BETWEEN ..) is a range scan on
    -- this index before the exact haversine distance is computed for the survivors.
    CREATE INDEX technicians_location_idx ON technicians (latitude, longitude) WHERE active;
    -- Sorting by hourly rate pages by (rate, id) keyset; the index returns rows already in that order.
    CREATE INDEX technicians_rate_idx ON technicians (hourly_rate_cents, id) WHERE active;
    -- Technology filter: "mill = ANY(technologies)" is rewritten as technologies @> ARRAY['mill'], which a GIN index answers.
    CREATE INDEX technicians_technologies_idx ON technicians USING gin (technologies);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    DROP INDEX technicians_technologies_idx;
    DROP INDEX technicians_rate_idx;
    DROP INDEX technicians_location_idx;
    DROP INDEX technician_standings_listable_idx;
  `);
}
