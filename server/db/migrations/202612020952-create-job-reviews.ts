import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE job_reviews (
      id serial PRIMARY KEY,
      -- One review per work order, enforced here so two buyers racing cannot both rate it.
      work_order_id integer NOT NULL UNIQUE REFERENCES work_orders(id),
      technician_id integer NOT NULL REFERENCES technicians(id),
      shop_company_id integer NOT NULL REFERENCES companies(id),
      author_user_id integer NOT NULL REFERENCES users(id),
      stars smallint NOT NULL CHECK (stars BETWEEN 1 AND 5),
      body text NOT NULL,
      reply text NULL,
      replied_by integer NULL REFERENCES users(id),
      replied_at timestamptz NULL,
      reported_at timestamptz NULL,
      report_reason text NULL,
      reported_by integer NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    CREATE INDEX job_reviews_technician_idx ON job_reviews (technician_id, id DESC);
    CREATE INDEX job_reviews_reported_idx ON job_reviews (reported_at) WHERE reported_at IS NOT NULL;
    -- Reviews are never deleted, and what the shop wrote never changes; only a reply and a report flag are added.
    CREATE FUNCTION job_reviews_keep() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'DELETE' THEN RAISE EXCEPTION 'job_reviews are never deleted'; END IF;
      IF NEW.stars <> OLD.stars OR NEW.body <> OLD.body OR NEW.work_order_id <> OLD.work_order_id
         OR NEW.author_user_id <> OLD.author_user_id OR NEW.technician_id <> OLD.technician_id THEN
        RAISE EXCEPTION 'a review''s stars and text cannot be changed';
      END IF;
      RETURN NEW;
    END $$;
    CREATE TRIGGER job_reviews_keep BEFORE UPDATE OR DELETE ON job_reviews
      FOR EACH ROW EXECUTE FUNCTION job_reviews_keep();
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE job_reviews");
  await sequelize.query("DROP FUNCTION IF EXISTS job_reviews_keep()");
}
