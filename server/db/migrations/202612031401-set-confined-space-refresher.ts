import type { MigrationContext } from "../migrate.ts";

// Confined-space training gets the same 12-month common-practice refresher as lockout/tagout (both regulations retrain
// on changes, with no calendar interval), and both catalog texts say a site's requirement set decides the interval.
// Rows an admin already edited keep the admin's interval and wording.
const NO_EXPIRY = JSON.stringify({ kind: "no_expiry" });
const OLD_CONFINED_SPACE_TEXT =
  "Entry into permit-required confined spaces such as coolant pits and chip conveyor trenches.";
const OLD_LOCKOUT_TEXT = "Control of hazardous energy while servicing machines (authorized employee).";
// The values as the catalog stood when this migration landed, written out so a later catalog edit cannot change it.
const TWELVE_MONTHS = JSON.stringify({ kind: "months_from_issue", months: 12 });
const SITE_DECIDES =
  "The 12-month interval is common practice, not a regulatory deadline; a site's requirement set decides the interval it wants.";
const confined = {
  code: "confined_space",
  description: `${OLD_CONFINED_SPACE_TEXT} 29 CFR 1910.146(g)(2) requires training when duties or permit-space hazards change. ${SITE_DECIDES}`,
};
const lockout = {
  code: "lockout_tagout",
  description: `${OLD_LOCKOUT_TEXT} 29 CFR 1910.147(c)(7)(iii) requires retraining when jobs, machines or procedures change. ${SITE_DECIDES}`,
};

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(
    `UPDATE credential_types SET validity = $1::jsonb, updated_at = now()
      WHERE code = 'confined_space' AND validity = $2::jsonb`,
    { bind: [TWELVE_MONTHS, NO_EXPIRY] },
  );
  for (const [type, oldText] of [
    [confined, OLD_CONFINED_SPACE_TEXT],
    [lockout, OLD_LOCKOUT_TEXT],
  ] as const) {
    await sequelize.query(
      `UPDATE credential_types SET description = $1, updated_at = now() WHERE code = $2 AND description = $3`,
      { bind: [type.description, type.code, oldText] },
    );
  }
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(
    `UPDATE credential_types SET validity = $1::jsonb, description = $2 WHERE code = 'confined_space'`,
    { bind: [NO_EXPIRY, OLD_CONFINED_SPACE_TEXT] },
  );
  await sequelize.query(`UPDATE credential_types SET description = $1 WHERE code = 'lockout_tagout'`, {
    bind: [OLD_LOCKOUT_TEXT],
  });
}
