import { readFileSync } from "node:fs";
import express from "express";
import pg from "pg";
import { PLANNER_OPTIONS } from "../../server/db/sequelize.ts";

// The two ceilings, as a child process like the real server: B0 a bare Express route with a constant JSON body; B1 the
// directory's own SQL (captured from the server's search code) through one route with pg alone, no session, no ORM.
// Env: PORT, DATABASE_URL, DIRECTORY_SQL_FILE (JSON: { name: { sql, bind } }).
const app = express();
const body = { ok: true, rows: [] as unknown[] };
app.get("/health", (_req, res) => {
  res.json({ ok: true });
});
app.get("/constant", (_req, res) => {
  res.json(body);
});
if (process.env.DATABASE_URL && process.env.DIRECTORY_SQL_FILE) {
  const statements = JSON.parse(readFileSync(process.env.DIRECTORY_SQL_FILE, "utf8")) as Record<
    string,
    { sql: string; bind: unknown[] }
  >;
  // The same pool size as the app's Sequelize pool (server/db/sequelize.ts).
  const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 10, options: PLANNER_OPTIONS });
  app.get("/directory/:name", async (req, res) => {
    const statement = statements[req.params.name];
    if (!statement) {
      res.status(404).end();
      return;
    }
    // Prepared per connection, as the server sends its directory statements (server/db/sql.ts preparedRows), so B1
    // stays the ceiling of the same statements sent the same way.
    const { rows } = await pool.query({
      name: `b1_${req.params.name}`,
      text: statement.sql,
      values: statement.bind,
    });
    res.json({ rows });
  });
}
app.listen(Number(process.env.PORT), "127.0.0.1");
