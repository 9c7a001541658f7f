import { DataTypes, literal } from "sequelize";
import type { MigrationContext } from "../migrate.ts";

export async function up({ queryInterface, sequelize }: MigrationContext) {
  await queryInterface.createTable("credentials", {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    type_code: {
      type: DataTypes.STRING(40),
      allowNull: false,
      references: { model: "credential_types", key: "code" },
    },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "companies", key: "id" } },
    // Null for credentials the company itself holds (insurance).
    technician_id: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: "technicians", key: "id" },
    },
    document_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "documents", key: "id" } },
    state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "submitted" },
    fields: { type: DataTypes.JSONB, allowNull: false },
    return_reason: { type: DataTypes.TEXT, allowNull: true },
    submitted_by: { type: DataTypes.INTEGER, allowNull: false, references: { model: "users", key: "id" } },
    submitted_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
    decided_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" } },
    decided_at: { type: DataTypes.DATE, allowNull: true },
    // The instant the credential stops counting, computed by the shared engine; null = never lapses.
    lapses_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
  });
  await sequelize.query(`
    ALTER TABLE credentials ADD CONSTRAINT credentials_state_check
      CHECK (state IN ('submitted','verified','returned','superseded','lapsed'));
    ALTER TABLE credentials ADD CONSTRAINT credentials_return_reason_check
      CHECK (state <> 'returned' OR return_reason IS NOT NULL);
    -- The reviewer queue reads submitted credentials oldest first.
    CREATE INDEX credentials_queue_idx ON credentials (submitted_at) WHERE state = 'submitted';
    -- The lapse job looks only at verified credentials with a lapse instant.
    CREATE INDEX credentials_lapse_idx ON credentials (lapses_at) WHERE state = 'verified';
    -- A holder's credentials: company-held and technician-held.
    CREATE INDEX credentials_company_idx ON credentials (company_id, type_code);
    CREATE INDEX credentials_technician_idx ON credentials (technician_id, type_code) WHERE technician_id IS NOT NULL;
  `);
}

export async function down({ queryInterface }: MigrationContext) {
  await queryInterface.dropTable("credentials");
}
