import { DataTypes, literal } from "sequelize";
import type { MigrationContext } from "../migrate.ts";

export async function up({ queryInterface }: MigrationContext) {
  await queryInterface.createTable("users", {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "companies", key: "id" } },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.STRING(24), allowNull: false },
    // Null until an invited user sets a password through the e-mailed link.
    password_hash: { type: DataTypes.STRING(100), allowNull: true },
    technician_id: { type: DataTypes.INTEGER, allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
  });
  await queryInterface.sequelize.query(
    "ALTER TABLE users ADD CONSTRAINT users_role_check CHECK (role IN ('provider_admin','technician','reviewer','buyer','admin'))",
  );
  await queryInterface.addIndex("users", ["company_id"]);
}

export async function down({ queryInterface }: MigrationContext) {
  await queryInterface.dropTable("users");
}
