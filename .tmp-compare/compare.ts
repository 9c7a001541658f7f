import { connectDatabase, db } from "/work/main/server/db/sequelize.ts";
import { initModels } from "/work/main/server/db/associations.ts";
import { findDirectoryTechnician } from "/work/main/server/directory/technician-profile.ts";
import { findDirectoryTechnician as oldFind } from "/work/main/.tmp-compare/old-profile.ts";
initModels(connectDatabase("postgres://postgres@127.0.0.1:54339/clearbench_large"));
const [buyer] = await db().query(`SELECT id, email, name, role, company_id AS "companyId", technician_id AS "technicianId" FROM users WHERE email = 'buyer-1@shop.large.test'`, { type: "SELECT" as never }) as any[];
const ids = await db().query(`SELECT b.technician_id AS id FROM technician_standings b JOIN technician_ratings r USING (technician_id) WHERE b.requirement_set_id IS NULL AND b.standing IN ('cleared','lapsing') ORDER BY b.technician_id LIMIT 40`, { type: "SELECT" as never }) as any[];
const asOf = new Date();
let same = 0, diff = 0, reviews = 0, sets = 0, creds = 0, est = 0;
for (const { id } of ids) {
  const a = await oldFind(buyer, id, 4, asOf);
  const b = await findDirectoryTechnician(buyer, id, 4, asOf);
  if (JSON.stringify(a) === JSON.stringify(b)) same++; else { diff++; if (diff < 2) console.log(JSON.stringify(a).slice(0, 3000), "\n---\n", JSON.stringify(b).slice(0, 3000)); }
  reviews += b.reviews.length; sets += b.requirementSets.length; creds += b.credentials.length; est += b.estimates.length;
}
console.log({ same, diff, reviews, sets, creds, est });
await db().close();
