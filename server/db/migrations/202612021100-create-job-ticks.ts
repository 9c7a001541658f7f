import { DataTypes, literal } from "sequelize";
import type { MigrationContext } from "../migrate.ts";

export async function up({ queryInterface }: MigrationContext) {
  // One row per scheduled run of a job: every server instance's timer fires, the first to insert the tick runs it.
  await queryInterface.createTable("job_ticks", {
    job: { type: DataTypes.STRING(40), primaryKey: true },
    tick: { type: DataTypes.DATE, primaryKey: true },
    claimed_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal("CURRENT_TIMESTAMP") },
  });
}

export async function down({ queryInterface }: MigrationContext) {
  await queryInterface.dropTable("job_ticks");
}
