import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- What the shop and the rated technician's company were found to share when the review was written (an e-mail
    -- domain, a phone number, an address): a sign that a company may be rating itself. Stored with the review so the
    -- flag does not move when either side edits its details later.
    ALTER TABLE job_reviews ADD COLUMN self_rating_signals text[] NOT NULL DEFAULT '{}';
    -- The admin's list reads only the flagged few, oldest first.
    CREATE INDEX job_reviews_self_rating_idx ON job_reviews (created_at) WHERE cardinality(self_rating_signals) > 0;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("ALTER TABLE job_reviews DROP COLUMN self_rating_signals");
}
