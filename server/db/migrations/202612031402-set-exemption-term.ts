import type { MigrationContext } from "../migrate.ts";

// A workers' compensation exemption without a printed expiry no longer counts forever: it counts for the usual term from
// its issue date (common practice, varies by state). A row an admin already edited keeps the admin's choice.
const DOCUMENT_DATES = JSON.stringify({ kind: "document_dates" });
const OLD_TEXT = "A state-issued exemption from carrying workers' compensation, where the state allows one.";
// The values as the catalog stood when this migration landed, written out so a later catalog edit cannot change it.
const TWENTY_FOUR_MONTHS = JSON.stringify({ kind: "months_from_issue", months: 24 });
const NEW_TEXT =
  "A state-issued exemption from carrying workers' compensation, for the persons it names (a sole proprietor or officers) only, never for employees. Without a printed expiry it counts for 24 months from issue (common practice; terms vary by state).";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(
    `UPDATE credential_types SET validity = $1::jsonb, updated_at = now()
      WHERE code = 'workers_comp_exemption' AND validity = $2::jsonb`,
    { bind: [TWENTY_FOUR_MONTHS, DOCUMENT_DATES] },
  );
  await sequelize.query(
    `UPDATE credential_types SET description = $1, updated_at = now()
      WHERE code = 'workers_comp_exemption' AND description = $2`,
    { bind: [NEW_TEXT, OLD_TEXT] },
  );
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(
    `UPDATE credential_types SET validity = $1::jsonb, description = $2 WHERE code = 'workers_comp_exemption'`,
    { bind: [DOCUMENT_DATES, OLD_TEXT] },
  );
}
