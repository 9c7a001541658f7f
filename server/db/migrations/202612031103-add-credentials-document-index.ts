import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- Every download asks which credentials stand on the file (who may read it follows from them); without an index
    -- that is a scan of the whole credentials table per download.
    CREATE INDEX credentials_document_idx ON credentials (document_id);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP INDEX credentials_document_idx");
}
