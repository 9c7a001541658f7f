import { DataTypes, literal } from "sequelize";
import type { MigrationContext } from "../migrate.ts";

export async function up({ queryInterface }: MigrationContext) {
  await queryInterface.createTable("documents", {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "companies", key: "id" } },
    uploaded_by: { type: DataTypes.INTEGER, allowNull: false, references: { model: "users", key: "id" } },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    mime: { type: DataTypes.STRING(40), allowNull: false },
    original_name: { type: DataTypes.STRING(255), allowNull: false },
    extracted_text: { type: DataTypes.TEXT, allowNull: true },
    extraction_method: { type: DataTypes.STRING(12), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
  });
  // The same file for another holder is a reviewer warning: look documents up by hash.
  await queryInterface.addIndex("documents", ["sha256"]);
  await queryInterface.addIndex("documents", ["company_id"]);
}

export async function down({ queryInterface }: MigrationContext) {
  await queryInterface.dropTable("documents");
}
