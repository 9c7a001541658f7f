import { DataTypes, literal } from "sequelize";
import type { MigrationContext } from "../migrate.ts";

export async function up({ queryInterface, sequelize }: MigrationContext) {
  await queryInterface.createTable("audit_events", {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    actor_user_id: { type: DataTypes.INTEGER, allowNull: true },
    action: { type: DataTypes.STRING(60), allowNull: false },
    subject_type: { type: DataTypes.STRING(40), allowNull: false },
    subject_id: { type: DataTypes.INTEGER, allowNull: false },
    before: { type: DataTypes.JSONB, allowNull: true },
    after: { type: DataTypes.JSONB, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
  });
  await queryInterface.addIndex("audit_events", ["subject_type", "subject_id"]);
  // Append-only: the audit trail is a record, so updates and deletes are refused by the database itself.
  await sequelize.query(`
    CREATE FUNCTION audit_events_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'audit_events is append-only'; END $$;
    CREATE TRIGGER audit_events_no_change BEFORE UPDATE OR DELETE ON audit_events
      FOR EACH ROW EXECUTE FUNCTION audit_events_append_only();
  `);
}

export async function down({ queryInterface, sequelize }: MigrationContext) {
  await queryInterface.dropTable("audit_events");
  await sequelize.query("DROP FUNCTION IF EXISTS audit_events_append_only()");
}
