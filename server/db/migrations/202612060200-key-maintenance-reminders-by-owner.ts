import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  // A plan travels with its machine when the machine is sold, so "once" is once per owning shop: the buyer of a
  // machine whose seller was already reminded 30 days ahead must still hear of the due date it now owns.
  await sequelize.query(`
    ALTER TABLE maintenance_reminders ADD COLUMN shop_company_id integer NULL REFERENCES companies(id);
    UPDATE maintenance_reminders r SET shop_company_id = s.company_id
      FROM maintenance_plans p JOIN equipment e ON e.id = p.equipment_id JOIN sites s ON s.id = e.site_id
     WHERE p.id = r.plan_id;
    ALTER TABLE maintenance_reminders ALTER COLUMN shop_company_id SET NOT NULL;
    ALTER TABLE maintenance_reminders DROP CONSTRAINT maintenance_reminders_once;
    ALTER TABLE maintenance_reminders
      ADD CONSTRAINT maintenance_reminders_once UNIQUE (plan_id, due_key, threshold_days, shop_company_id);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    DELETE FROM maintenance_reminders r USING maintenance_reminders older
     WHERE older.plan_id = r.plan_id AND older.due_key = r.due_key AND older.threshold_days = r.threshold_days
       AND older.id < r.id;
    ALTER TABLE maintenance_reminders DROP CONSTRAINT maintenance_reminders_once;
    ALTER TABLE maintenance_reminders ADD CONSTRAINT maintenance_reminders_once UNIQUE (plan_id, due_key, threshold_days);
    ALTER TABLE maintenance_reminders DROP COLUMN shop_company_id;
  `);
}
