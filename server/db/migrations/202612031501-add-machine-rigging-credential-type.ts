import type { MigrationContext } from "../migrate.ts";

// The row as it stood when this migration landed (a fixed copy, not read from the catalog, so later edits to the
// catalog never change what this migration did). A fresh database already has it from the create-credential-types
// seed, which reads the current catalog; hence ON CONFLICT DO NOTHING.
const RIGGING = {
  code: "machine_rigging",
  name: "Machine rigging and moving",
  category: "safety",
  holder: "technician",
  fieldSet: "training",
  validity: { kind: "no_expiry" },
  description:
    "Training in rigging, lifting and moving machine tools. The card shows training only: every lift follows the site's lift plan, the rated capacity of the gear and floor loading checked with the site.",
};

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(
    `INSERT INTO credential_types (code, name, category, holder, field_set, validity, description)
     VALUES (:code, :name, :category, :holder, :fieldSet, CAST(:validity AS jsonb), :description)
     ON CONFLICT (code) DO NOTHING`,
    { replacements: { ...RIGGING, validity: JSON.stringify(RIGGING.validity) } },
  );
}

export async function down({ sequelize }: MigrationContext) {
  // Only while nothing refers to it; a credential of this type keeps the row (the foreign key refuses the delete).
  await sequelize.query(`DELETE FROM credential_types WHERE code = 'machine_rigging'`);
}
