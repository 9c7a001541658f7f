import type { MigrationContext } from "../migrate.ts";
import { defaultBaseline } from "../../../shared/standing/requirements.ts";

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE platform_baseline (
      -- A single row: the check keeps it single.
      id integer PRIMARY KEY DEFAULT 1 CHECK (id = 1),
      requirements jsonb NOT NULL,
      updated_by integer NULL REFERENCES users(id),
      updated_at timestamptz NOT NULL DEFAULT CURRENT_TIMESTAMP
    )
  `);
  await sequelize.query("INSERT INTO platform_baseline (id, requirements) VALUES (1, $1::jsonb)", {
    bind: [JSON.stringify(defaultBaseline.requirements)],
  });
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("DROP TABLE platform_baseline");
}
