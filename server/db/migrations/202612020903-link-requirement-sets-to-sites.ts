import type { MigrationContext } from "../migrate.ts";

// requirement_sets.site_id was created before the sites table existed; it gets its foreign key now.
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(
    "ALTER TABLE requirement_sets ADD CONSTRAINT requirement_sets_site_fk FOREIGN KEY (site_id) REFERENCES sites(id)",
  );
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query("ALTER TABLE requirement_sets DROP CONSTRAINT requirement_sets_site_fk");
}
