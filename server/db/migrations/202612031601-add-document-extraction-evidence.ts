import type { MigrationContext } from "../migrate.ts";

// Where each proposed value was read on the page and how sure the reader was, by credential type, so the reviewer's
// page can highlight the box of the field in focus. Kept on the document (read once, shared by every coverage sent
// from it); no index: it is only read with its document by primary key.
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`ALTER TABLE documents ADD COLUMN extraction_evidence jsonb`);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`ALTER TABLE documents DROP COLUMN extraction_evidence`);
}
