import { DataTypes, literal } from "sequelize";
import type { MigrationContext } from "../migrate.ts";

export async function up({ queryInterface }: MigrationContext) {
  await queryInterface.createTable("companies", {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    kind: { type: DataTypes.STRING(16), allowNull: false },
    address_line: { type: DataTypes.STRING(200), allowNull: true },
    postal_code: { type: DataTypes.STRING(10), allowNull: true },
    // IANA zone of the mailing address: the policy period's 12:01 a.m. is read in this zone.
    time_zone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: "America/Chicago" },
    latitude: { type: DataTypes.DOUBLE, allowNull: true },
    longitude: { type: DataTypes.DOUBLE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
  });
  await queryInterface.sequelize.query(
    "ALTER TABLE companies ADD CONSTRAINT companies_kind_check CHECK (kind IN ('service','shop','platform'))",
  );
}

export async function down({ queryInterface }: MigrationContext) {
  await queryInterface.dropTable("companies");
}
