import type { MigrationContext } from "../migrate.ts";

// A running count and star sum per technician, kept up to date by the review use case in the same transaction as the
// review, so the directory reads a rating with one primary-key join instead of aggregating every review per search.
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE technician_ratings (
      technician_id integer PRIMARY KEY REFERENCES technicians(id),
      review_count integer NOT NULL DEFAULT 0 CHECK (review_count >= 0),
      star_sum integer NOT NULL DEFAULT 0 CHECK (star_sum >= 0),
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE technician_ratings");
}
