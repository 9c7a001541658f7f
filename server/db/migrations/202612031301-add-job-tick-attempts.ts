import type { MigrationContext } from "../migrate.ts";

/**
 * A claimed tick now records how its run went: `running` under a lease (a crashed run is found when the lease runs
 * out), `retrying` until `next_attempt_at`, `succeeded`, or `failed` once every attempt is used. Ticks claimed before
 * this change finished as far as anyone knows.
 */
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    ALTER TABLE job_ticks
      ADD COLUMN status varchar(12) NOT NULL DEFAULT 'succeeded',
      ADD COLUMN attempts integer NOT NULL DEFAULT 1,
      ADD COLUMN lease_until timestamptz NULL,
      ADD COLUMN next_attempt_at timestamptz NULL,
      ADD COLUMN last_error text NULL
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    ALTER TABLE job_ticks
      DROP COLUMN status, DROP COLUMN attempts, DROP COLUMN lease_until, DROP COLUMN next_attempt_at,
      DROP COLUMN last_error
  `);
}
