import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- A file posted in a work-order thread belongs to that work order's two parties, not to the uploading company's
    -- credential files: the column tells the two kinds apart without a join on every download, and keeps an
    -- attachment from ever being submitted as a credential document.
    ALTER TABLE documents ADD COLUMN work_order_id integer NULL REFERENCES work_orders(id);
    UPDATE documents d SET work_order_id = m.work_order_id
      FROM work_order_messages m WHERE m.document_id = d.id;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("ALTER TABLE documents DROP COLUMN work_order_id");
}
