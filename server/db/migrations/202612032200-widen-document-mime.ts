import type { MigrationContext } from "../migrate.ts";

// A spreadsheet's media type (application/vnd.openxmlformats-officedocument.spreadsheetml.sheet) is 65 characters;
// 40 held only the PDF and image types. Widening a varchar rewrites no rows.
export async function up({ queryInterface }: MigrationContext) {
  await queryInterface.sequelize.query("ALTER TABLE documents ALTER COLUMN mime TYPE varchar(100)");
}

export async function down({ queryInterface }: MigrationContext) {
  await queryInterface.sequelize.query("ALTER TABLE documents ALTER COLUMN mime TYPE varchar(40)");
}
