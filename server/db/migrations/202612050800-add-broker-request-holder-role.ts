import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- How the shop is to be named: as certificate holder only, or also shown as additional insured.
    ALTER TABLE broker_upload_requests
      ADD COLUMN holder_role varchar(24) NOT NULL DEFAULT 'certificate_holder'
        CHECK (holder_role IN ('certificate_holder', 'additional_insured'));
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("ALTER TABLE broker_upload_requests DROP COLUMN holder_role");
}
