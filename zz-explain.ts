import setup from "/work/main/tests/support/global-setup.ts";
import { buildTestApp } from "/work/main/tests/support/test-app.ts";
import { buildDirectoryWorld } from "/work/main/tests/fixtures/build-directory-world.ts";
import { searchDirectory } from "/work/main/server/directory/search.ts";
import { directoryQuerySchema } from "/work/main/shared/directory/schemas.ts";
import { User } from "/work/main/server/accounts/model.ts";
import { db } from "/work/main/server/db/sequelize.ts";
import { QueryTypes } from "sequelize";
const teardown = await setup();
try {
  buildTestApp();
  const world = await buildDirectoryWorld({ seed: 3, count: 500, companies: 50 });
  const user = (await User.findOne({ where: { email: world.buyerEmail } }))!;
  const u = { id: user.id, companyId: user.companyId, role: "buyer" } as Express.User;
  const orig = db().query.bind(db());
  let captured: { sql: string; bind: unknown[] } | null = null;
  (db() as any).query = (sql: string, opts: any) => { if (sql.includes("sort_key")) captured = { sql, bind: opts.bind }; return orig(sql, opts); };
  await db().query("ANALYZE");
  const q = directoryQuerySchema.parse({ siteId: String(world.site.id) });
  let t0 = performance.now(); await searchDirectory(u, q); console.log("first", performance.now() - t0);
  t0 = performance.now(); await searchDirectory(u, q); console.log("second", performance.now() - t0);
  const c = captured!;
  const plan = await orig(`EXPLAIN ANALYZE ${c.sql}`, { bind: c.bind, type: QueryTypes.SELECT });
  console.log(plan.map((r: any) => r["QUERY PLAN"]).join("\n"));
} finally { teardown(); }
process.exit(0);
