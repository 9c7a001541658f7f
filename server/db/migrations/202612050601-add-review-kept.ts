import type { MigrationContext } from "../migrate.ts";

/** An admin who reads a report and keeps the review counted says so; the review itself never changes. */
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    ALTER TABLE job_reviews ADD COLUMN kept_at timestamptz NULL,
      ADD COLUMN kept_by integer NULL REFERENCES users(id),
      ADD CONSTRAINT job_reviews_kept_or_excluded_check CHECK (kept_at IS NULL OR excluded_at IS NULL)
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("ALTER TABLE job_reviews DROP COLUMN kept_at, DROP COLUMN kept_by");
}
