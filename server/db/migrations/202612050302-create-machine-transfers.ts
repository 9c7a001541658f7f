import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE machine_transfers (
      id serial PRIMARY KEY,
      equipment_id integer NOT NULL REFERENCES equipment(id) ON DELETE CASCADE,
      from_company_id integer NOT NULL REFERENCES companies(id),
      to_company_id integer NOT NULL REFERENCES companies(id),
      to_email varchar(254) NOT NULL,
      note text NULL,
      state varchar(12) NOT NULL DEFAULT 'open' CHECK (state IN ('open','accepted','declined','withdrawn')),
      started_by integer NULL REFERENCES users(id),
      decided_by integer NULL REFERENCES users(id),
      decided_at timestamptz NULL,
      decline_reason text NULL,
      to_site_id integer NULL REFERENCES sites(id),
      machine_snapshot jsonb NULL,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      CHECK (from_company_id <> to_company_id)
    );
    -- One open transfer per machine: a second one while the first waits is refused by the database too.
    CREATE UNIQUE INDEX machine_transfers_open_idx ON machine_transfers (equipment_id) WHERE state = 'open';
    -- A shop's incoming and outgoing lists.
    CREATE INDEX machine_transfers_to_idx ON machine_transfers (to_company_id, created_at DESC);
    CREATE INDEX machine_transfers_from_idx ON machine_transfers (from_company_id, created_at DESC);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE machine_transfers");
}
