import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- What a credential document was uploaded as (its type) and for whom (a technician, or NULL for the company), so
    -- a submission can be held to the same type kind and holder, and a technician reads the files uploaded for them.
    -- Rows from before are filled from the first credential that used them; an unused old upload stays NULL.
    ALTER TABLE documents ADD COLUMN type_code varchar(40) NULL REFERENCES credential_types(code),
      ADD COLUMN technician_id integer NULL REFERENCES technicians(id);
    UPDATE documents d SET type_code = c.type_code, technician_id = c.technician_id
      FROM (SELECT DISTINCT ON (document_id) document_id, type_code, technician_id FROM credentials
             ORDER BY document_id, id) c
     WHERE c.document_id = d.id AND d.work_order_id IS NULL;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("ALTER TABLE documents DROP COLUMN type_code, DROP COLUMN technician_id");
}
