import { DataTypes, literal } from "sequelize";
import type { MigrationContext } from "../migrate.ts";

export async function up({ queryInterface }: MigrationContext) {
  await queryInterface.createTable("outbox_messages", {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    text_body: { type: DataTypes.TEXT, allowNull: false },
    html_body: { type: DataTypes.TEXT, allowNull: true },
    status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "pending" },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    next_attempt_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
  });
  // The sender only ever looks for due, unsent rows.
  await queryInterface.sequelize.query(
    "CREATE INDEX outbox_due_idx ON outbox_messages (next_attempt_at) WHERE status = 'pending'",
  );
  await queryInterface.createTable("caught_mails", {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    from_address: { type: DataTypes.TEXT, allowNull: false },
    to_address: { type: DataTypes.TEXT, allowNull: false },
    subject: { type: DataTypes.TEXT, allowNull: false },
    text_body: { type: DataTypes.TEXT, allowNull: false },
    html_body: { type: DataTypes.TEXT, allowNull: true },
    received_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
  });
}

export async function down({ queryInterface }: MigrationContext) {
  await queryInterface.dropTable("caught_mails");
  await queryInterface.dropTable("outbox_messages");
}
