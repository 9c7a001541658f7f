import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE service_request_estimate_revisions (
      id serial PRIMARY KEY,
      estimate_id integer NOT NULL REFERENCES service_request_estimates(id),
      revision integer NOT NULL,
      technician_id integer NOT NULL REFERENCES technicians(id),
      hourly_rate_cents integer NOT NULL,
      travel_rate_cents integer NOT NULL,
      mileage_rate_cents integer NOT NULL,
      on_site_hours numeric(6,2) NOT NULL,
      earliest_arrival timestamptz NOT NULL,
      parts jsonb NOT NULL,
      note text NULL,
      valid_until date NOT NULL,
      distance_km double precision NOT NULL,
      travel_cents integer NOT NULL,
      labour_cents integer NOT NULL,
      mileage_cents integer NOT NULL,
      parts_cents integer NOT NULL,
      total_cents integer NOT NULL,
      created_by integer NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- Each revision once; the latest is found by (estimate_id, revision DESC).
    CREATE UNIQUE INDEX service_request_estimate_revisions_key ON service_request_estimate_revisions (estimate_id, revision);
    -- Revisions are the record of what was offered: the database refuses edits and deletions.
    CREATE FUNCTION service_request_estimate_revisions_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'service_request_estimate_revisions is append-only'; END $$;
    CREATE TRIGGER service_request_estimate_revisions_no_change BEFORE UPDATE OR DELETE ON service_request_estimate_revisions
      FOR EACH ROW EXECUTE FUNCTION service_request_estimate_revisions_append_only();
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE service_request_estimate_revisions");
  await sequelize.query("DROP FUNCTION IF EXISTS service_request_estimate_revisions_append_only()");
}
