import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- A review is never deleted; an admin may leave it out of the technician's score, saying why.
    ALTER TABLE job_reviews ADD COLUMN excluded_at timestamptz NULL,
      ADD COLUMN excluded_by integer NULL REFERENCES users(id),
      ADD COLUMN exclusion_reason text NULL,
      ADD CONSTRAINT job_reviews_exclusion_reason_check CHECK ((excluded_at IS NULL) = (exclusion_reason IS NULL));
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(
    "ALTER TABLE job_reviews DROP COLUMN excluded_at, DROP COLUMN excluded_by, DROP COLUMN exclusion_reason",
  );
}
