import { DataTypes, literal } from "sequelize";
import type { MigrationContext } from "../migrate.ts";

export async function up({ queryInterface, sequelize }: MigrationContext) {
  await queryInterface.createTable("technicians", {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "companies", key: "id" } },
    name: { type: DataTypes.STRING(160), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: true },
    phone: { type: DataTypes.STRING(40), allowNull: true },
    technologies: { type: DataTypes.ARRAY(DataTypes.STRING(40)), allowNull: false, defaultValue: [] },
    control_families: { type: DataTypes.ARRAY(DataTypes.STRING(80)), allowNull: false, defaultValue: [] },
    postal_code: { type: DataTypes.STRING(10), allowNull: false },
    latitude: { type: DataTypes.DOUBLE, allowNull: true },
    longitude: { type: DataTypes.DOUBLE, allowNull: true },
    service_radius_km: { type: DataTypes.INTEGER, allowNull: false },
    hourly_rate_cents: { type: DataTypes.INTEGER, allowNull: false },
    travel_rate_cents: { type: DataTypes.INTEGER, allowNull: false },
    mileage_rate_cents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 73 },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
  });
  // Every provider screen lists technicians by company.
  await queryInterface.addIndex("technicians", ["company_id"]);
  await sequelize.query(
    "ALTER TABLE users ADD CONSTRAINT users_technician_fk FOREIGN KEY (technician_id) REFERENCES technicians(id)",
  );
}

export async function down({ queryInterface, sequelize }: MigrationContext) {
  await sequelize.query("ALTER TABLE users DROP CONSTRAINT users_technician_fk");
  await queryInterface.dropTable("technicians");
}
