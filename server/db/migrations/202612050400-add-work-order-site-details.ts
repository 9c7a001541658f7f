import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- Defaults a buyer's new work order starts from; each work order keeps its own copy, so a later edit of the
    -- site does not rewrite what a technician was sent.
    ALTER TABLE sites
      ADD COLUMN contact_name varchar(120) NULL,
      ADD COLUMN contact_phone varchar(40) NULL,
      ADD COLUMN safety_induction_note text NULL,
      ADD COLUMN default_po_number varchar(40) NULL,
      ADD COLUMN default_not_to_exceed_cents integer NULL CHECK (default_not_to_exceed_cents > 0);
    ALTER TABLE work_orders
      ADD COLUMN site_contact_name varchar(120) NULL,
      ADD COLUMN site_contact_phone varchar(40) NULL,
      ADD COLUMN po_number varchar(40) NULL,
      -- Whole cents, never a float: a spending cap the service side must not pass without asking.
      ADD COLUMN not_to_exceed_cents integer NULL CHECK (not_to_exceed_cents > 0),
      ADD COLUMN safety_induction_note text NULL;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    ALTER TABLE work_orders DROP COLUMN site_contact_name, DROP COLUMN site_contact_phone, DROP COLUMN po_number,
      DROP COLUMN not_to_exceed_cents, DROP COLUMN safety_induction_note;
    ALTER TABLE sites DROP COLUMN contact_name, DROP COLUMN contact_phone, DROP COLUMN safety_induction_note,
      DROP COLUMN default_po_number, DROP COLUMN default_not_to_exceed_cents;
  `);
}
