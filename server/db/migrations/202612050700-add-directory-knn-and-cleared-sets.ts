import type { MigrationContext } from "../migrate.ts";

// The unit-sphere point of a technician (x, y, z from latitude and longitude). The chord between two such points is
// 2·sin(d / 2R) for a great-circle distance d, so ordering by the chord is ordering by distance, and the cube GiST
// index answers both "nearest first" (<->) and "within this box" (<@) without a table scan. Plain cube, not
// earthdistance's ll_to_earth, so the column and index carry no function body that a restore would re-resolve.
const POINT = `CASE WHEN latitude IS NULL OR longitude IS NULL THEN NULL ELSE cube(ARRAY[
    cos(radians(latitude)) * cos(radians(longitude)),
    cos(radians(latitude)) * sin(radians(longitude)),
    sin(radians(latitude))]) END`;

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE EXTENSION IF NOT EXISTS cube;
    ALTER TABLE technicians ADD COLUMN sphere_point cube GENERATED ALWAYS AS (${POINT}) STORED;
    -- The requirement sets (0 = the platform baseline) whose stored standing lists the technician (cleared or
    -- lapsing): one row-local fact the directory tests instead of looking up a standing row per candidate.
    ALTER TABLE technicians ADD COLUMN cleared_sets integer[] NOT NULL DEFAULT '{}';
    UPDATE technicians t SET cleared_sets = s.sets
      FROM (SELECT technician_id, array_agg(coalesce(requirement_set_id, 0) ORDER BY coalesce(requirement_set_id, 0)) AS sets
              FROM technician_standings WHERE standing IN ('cleared','lapsing') GROUP BY technician_id) s
     WHERE s.technician_id = t.id;

    -- Kept by the database from every write to technician_standings (the standing refresh, the lapse job, a set's
    -- removal), so no writer can forget it. Statement-level: one UPDATE for all technicians a statement touched.
    CREATE FUNCTION refresh_cleared_sets() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      UPDATE technicians t SET cleared_sets = coalesce(
          (SELECT array_agg(coalesce(s.requirement_set_id, 0) ORDER BY coalesce(s.requirement_set_id, 0))
             FROM technician_standings s WHERE s.technician_id = t.id AND s.standing IN ('cleared','lapsing')), '{}')
       WHERE t.id IN (SELECT technician_id FROM changed_rows)
         AND t.cleared_sets IS DISTINCT FROM coalesce(
          (SELECT array_agg(coalesce(s.requirement_set_id, 0) ORDER BY coalesce(s.requirement_set_id, 0))
             FROM technician_standings s WHERE s.technician_id = t.id AND s.standing IN ('cleared','lapsing')), '{}');
      RETURN NULL;
    END $$;
    CREATE TRIGGER technician_standings_cleared_sets_ins AFTER INSERT ON technician_standings
      REFERENCING NEW TABLE AS changed_rows FOR EACH STATEMENT EXECUTE FUNCTION refresh_cleared_sets();
    CREATE TRIGGER technician_standings_cleared_sets_upd AFTER UPDATE ON technician_standings
      REFERENCING NEW TABLE AS changed_rows FOR EACH STATEMENT EXECUTE FUNCTION refresh_cleared_sets();
    CREATE TRIGGER technician_standings_cleared_sets_del AFTER DELETE ON technician_standings
      REFERENCING OLD TABLE AS changed_rows FOR EACH STATEMENT EXECUTE FUNCTION refresh_cleared_sets();

    -- Directory candidates: active and listed by the baseline, nearest first or inside a radius box.
    CREATE INDEX technicians_listed_point_idx ON technicians USING gist (sphere_point)
      WHERE active AND cleared_sets @> '{0}'::integer[];
    CREATE INDEX technicians_cleared_sets_idx ON technicians USING gin (cleared_sets);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    DROP TRIGGER technician_standings_cleared_sets_del ON technician_standings;
    DROP TRIGGER technician_standings_cleared_sets_upd ON technician_standings;
    DROP TRIGGER technician_standings_cleared_sets_ins ON technician_standings;
    DROP FUNCTION refresh_cleared_sets();
    ALTER TABLE technicians DROP COLUMN cleared_sets;
    ALTER TABLE technicians DROP COLUMN sphere_point;
  `);
}
