import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- The reviewers' queue pages submitted credentials by (submitted_at, id) and counts them with the same filters
    -- (type, company, waiting time): this index returns the page already in order and answers the count from the index
    -- alone, where the count used to visit every submitted row's table page.
    CREATE INDEX credentials_queue_cover_idx ON credentials (submitted_at, id)
      INCLUDE (type_code, company_id, technician_id) WHERE state = 'submitted';
    DROP INDEX credentials_queue_idx;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE INDEX credentials_queue_idx ON credentials (submitted_at) WHERE state = 'submitted';
    DROP INDEX credentials_queue_cover_idx;
  `);
}
