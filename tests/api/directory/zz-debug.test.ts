import { it } from "vitest";
import { buildTestApp } from "../../support/test-app.ts";
import { buildDirectoryWorld } from "../../fixtures/build-directory-world.ts";
import { searchDirectory } from "../../../server/directory/search.ts";
import { directoryQuerySchema } from "../../../shared/directory/schemas.ts";
import { User } from "../../../server/accounts/model.ts";
it("debug", async () => {
  buildTestApp();
  const world = await buildDirectoryWorld({ seed: 11, count: 30 });
  const user = (await User.findOne({ where: { email: world.buyerEmail } }))!;
  const u = { id: user.id, companyId: user.companyId, role: "buyer" } as Express.User;
  let q = directoryQuerySchema.parse({ minAutoCsl: "1000000", sort: "score", limit: "1" });
  for (let i = 0; i < 40; i++) {
    try {
      const page = await searchDirectory(u, q);
      console.log(page.rows.map((r) => r.technicianId), page.nextCursor);
      if (!page.nextCursor) break;
      q = { ...q, cursor: page.nextCursor };
    } catch (e) { console.log("ERR", e); break; }
  }
});
