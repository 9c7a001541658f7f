import type { MigrationContext } from "../migrate.ts";

export async function up({ sequelize }: MigrationContext) {
  // Which shop owned a machine when: a service history entry belongs to the period holding its date, so what a former
  // or a new owner may read of it is a range query. A trigger opens the first period for every new machine row
  // whichever path inserts it (the form, an import, the demo scenario), so no machine is ever without an owner.
  await sequelize.query(`
    CREATE TABLE machine_ownerships (
      id serial PRIMARY KEY,
      equipment_id integer NOT NULL REFERENCES equipment(id) ON DELETE CASCADE,
      company_id integer NOT NULL REFERENCES companies(id),
      from_at timestamptz NOT NULL,
      to_at timestamptz NULL,
      CHECK (to_at IS NULL OR to_at >= from_at)
    );
    -- A machine is in one shop at a time: at most one open period per machine.
    CREATE UNIQUE INDEX machine_ownerships_open_idx ON machine_ownerships (equipment_id) WHERE to_at IS NULL;
    -- The periods of one machine in order, and the machines a shop owns or once owned.
    CREATE INDEX machine_ownerships_equipment_idx ON machine_ownerships (equipment_id, from_at);
    CREATE INDEX machine_ownerships_company_idx ON machine_ownerships (company_id, equipment_id);

    INSERT INTO machine_ownerships (equipment_id, company_id, from_at)
      SELECT e.id, s.company_id, e.created_at FROM equipment e JOIN sites s ON s.id = e.site_id;

    CREATE FUNCTION open_machine_ownership() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      INSERT INTO machine_ownerships (equipment_id, company_id, from_at)
        SELECT NEW.id, s.company_id, NEW.created_at FROM sites s WHERE s.id = NEW.site_id;
      RETURN NEW;
    END $$;
    CREATE TRIGGER equipment_opens_ownership AFTER INSERT ON equipment
      FOR EACH ROW EXECUTE FUNCTION open_machine_ownership();
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    DROP TRIGGER equipment_opens_ownership ON equipment;
    DROP FUNCTION open_machine_ownership();
    DROP TABLE machine_ownerships;
  `);
}
