import type { MigrationContext } from "../migrate.ts";

// Invented builders and control families (a fixed copy, so later catalog edits never change what this did).
const SEED: { kind: "builder" | "control_family"; name: string; aliases: string[] }[] = [
  { kind: "builder", name: "Vantor Machine Works", aliases: ["Vantor", "VMW"] },
  { kind: "builder", name: "Halden Axis Systems", aliases: ["Halden"] },
  { kind: "builder", name: "Orrin & Vale Toolworks", aliases: ["Orrin and Vale", "Orrin & Vale"] },
  { kind: "builder", name: "Strell Spark Systems", aliases: ["Strell"] },
  { kind: "control_family", name: "Kestle 40", aliases: ["Kestle-40", "K40"] },
  { kind: "control_family", name: "Kestle 60L", aliases: ["Kestle-60L", "K60L"] },
  { kind: "control_family", name: "Halden HX-7", aliases: ["HX-7", "HX7"] },
  { kind: "control_family", name: "Linea 9", aliases: ["Linea-9"] },
  { kind: "control_family", name: "Spark 5", aliases: ["Spark-5"] },
];

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE machine_catalog_entries (
      id serial PRIMARY KEY,
      kind varchar(16) NOT NULL CHECK (kind IN ('builder','control_family')),
      name varchar(120) NOT NULL,
      aliases varchar(120)[] NOT NULL DEFAULT '{}',
      active boolean NOT NULL DEFAULT true,
      created_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    );
    -- One entry per name of a kind, whatever its case or spacing.
    CREATE UNIQUE INDEX machine_catalog_name_key
      ON machine_catalog_entries (kind, lower(regexp_replace(btrim(name), '\\s+', ' ', 'g')));
  `);
  for (const e of SEED)
    await sequelize.query(
      `INSERT INTO machine_catalog_entries (kind, name, aliases) VALUES (:kind, :name, ARRAY[:aliases]::varchar[])`,
      { replacements: e },
    );
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE machine_catalog_entries");
}
