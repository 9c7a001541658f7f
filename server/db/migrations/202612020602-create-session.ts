import type { MigrationContext } from "../migrate.ts";

// The table connect-pg-simple reads and writes (its documented schema), created here so migrations own the schema.
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE "session" (
      "sid" varchar NOT NULL COLLATE "default" PRIMARY KEY,
      "sess" json NOT NULL,
      "expire" timestamp(6) NOT NULL
    );
    CREATE INDEX "IDX_session_expire" ON "session" ("expire");
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query('DROP TABLE "session"');
}
