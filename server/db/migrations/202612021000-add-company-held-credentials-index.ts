import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- The directory's "held in force" test has a company-held branch: EXISTS (... cr.company_id = t.company_id AND
    -- cr.technician_id IS NULL AND cr.type_code = $type ...). With only credentials_company_idx (company_id, type_code),
    -- which also holds every technician's cards, EXPLAIN on the large data set (bench/results/explain-directory.txt,
    -- search "oem-rating") showed each probe reading about 20 heap rows of the company's technicians only to discard
    -- them: a third of the buffers of the whole search. This partial index holds just the company-held rows (insurance,
    -- about 6 % of the table), so a probe for a technician-held type finds nothing without touching the heap.
    CREATE INDEX credentials_company_held_idx ON credentials (company_id, type_code) WHERE technician_id IS NULL;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP INDEX credentials_company_held_idx");
}
