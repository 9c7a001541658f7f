import { DataTypes, literal } from "sequelize";
import type { MigrationContext } from "../migrate.ts";
import { credentialTypes } from "../../../shared/credentials/catalogue.ts";

export async function up({ queryInterface }: MigrationContext) {
  await queryInterface.createTable("credential_types", {
    code: { type: DataTypes.STRING(40), primaryKey: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    category: { type: DataTypes.STRING(16), allowNull: false },
    holder: { type: DataTypes.STRING(16), allowNull: false },
    field_set: { type: DataTypes.STRING(16), allowNull: false },
    validity: { type: DataTypes.JSONB, allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
  });
  // Seeded from the catalogue as it stood when this migration landed; admins edit it afterwards.
  await queryInterface.bulkInsert(
    "credential_types",
    credentialTypes.map((t) => ({
      code: t.code,
      name: t.name,
      category: t.category,
      holder: t.holder,
      field_set: t.fieldSet,
      validity: JSON.stringify(t.validity),
      description: t.description,
    })),
  );
}

export async function down({ queryInterface }: MigrationContext) {
  await queryInterface.dropTable("credential_types");
}
