import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- Who asked: the company's office, or a shop through the platform (then requested_by is that shop's buyer).
    ALTER TABLE broker_upload_requests
      ADD COLUMN origin varchar(16) NOT NULL DEFAULT 'office' CHECK (origin IN ('office', 'shop'));
    -- A shop's own list of what it asked for.
    CREATE INDEX broker_upload_requests_shop_idx ON broker_upload_requests (shop_company_id, id)
      WHERE shop_company_id IS NOT NULL;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(
    "DROP INDEX broker_upload_requests_shop_idx; ALTER TABLE broker_upload_requests DROP COLUMN origin",
  );
}
