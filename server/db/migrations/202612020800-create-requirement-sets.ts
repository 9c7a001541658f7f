import { DataTypes, literal } from "sequelize";
import type { MigrationContext } from "../migrate.ts";

export async function up({ queryInterface }: MigrationContext) {
  await queryInterface.createTable("requirement_sets", {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "companies", key: "id" } },
    // The shop's site; the Directory work adds the sites table and this column's foreign key later.
    site_id: { type: DataTypes.INTEGER, allowNull: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    requirements: { type: DataTypes.JSONB, allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
  });
  // A buyer lists the sets of their own shop.
  await queryInterface.addIndex("requirement_sets", ["company_id"]);
}

export async function down({ queryInterface }: MigrationContext) {
  await queryInterface.dropTable("requirement_sets");
}
