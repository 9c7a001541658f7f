import { writeFile } from "node:fs/promises";
import path from "node:path";
import pg from "pg";
import type { Sequelize } from "sequelize";
import { directoryQuerySchema } from "../../shared/directory/schemas.ts";
import { searchDirectory } from "../../server/directory/search.ts";
import { IDS } from "./large-data-sql.ts";

/** Buyer of shop 1, site 1 (a real ZIP centroid); the three filter combinations measured. */
export const BENCH_BUYER = { ordinal: 1, email: "buyer-1@shop.large.test", siteId: 1 };

export const DIRECTORY_SEARCHES: { name: string; label: string; query: Record<string, string> }[] = [
  { name: "near-site", label: "site, 100 miles, by distance", query: { siteId: "1" } },
  {
    name: "site-cards-gl",
    label: "site + 2 cards + mill + GL 1M/2M",
    query: {
      siteId: "1",
      radiusMiles: "250",
      credentialTypes: "arc_flash,lockout_tagout",
      technology: "mill",
      minEachOccurrence: "1000000",
      minAggregate: "2000000",
    },
  },
  {
    name: "oem-rating",
    label: "OEM builder/control/level 2 + rating 4, by score",
    query: {
      oemBuilder: "Vantor Machine Works",
      controlFamily: "Kestle 40",
      minOemLevel: "2",
      minRating: "4",
    },
  },
];

export interface CapturedStatement {
  sql: string;
  bind: unknown[];
}

/**
 * Runs the server's own directory search in this process and records the statements it sends, so the EXPLAIN and the
 * pg-only ceiling (B1) use exactly the SQL the API runs, not a copy that could drift.
 */
export async function captureDirectoryStatements(
  sequelize: Sequelize,
): Promise<Record<string, CapturedStatement>> {
  const buyer = {
    id: IDS.buyerUser(BENCH_BUYER.ordinal),
    email: BENCH_BUYER.email,
    name: "Buyer 1",
    role: "buyer" as const,
    companyId: IDS.shopCompany(BENCH_BUYER.ordinal),
    technicianId: null,
  };
  const original = sequelize.query.bind(sequelize);
  const seen: CapturedStatement[] = [];
  (sequelize as unknown as { query: unknown }).query = (sql: string, options?: { bind?: unknown[] }) => {
    seen.push({ sql, bind: options?.bind ?? [] });
    return (original as (s: string, o?: unknown) => Promise<unknown>)(sql, options);
  };
  // The hot statements go to the pool's pg client directly (preparedRows): each client handed out records them too.
  // Sequelize's own calls (text, values, callback) pass through untouched; only preparedRows' config objects are recorded.
  type Client = { query: (...args: unknown[]) => unknown };
  const manager = sequelize.connectionManager as unknown as {
    getConnection: (o?: unknown) => Promise<Client>;
  };
  const getConnection = manager.getConnection.bind(manager);
  const clientQuery = new Map<Client, Client["query"]>();
  manager.getConnection = async (o?: unknown) => {
    const client = await getConnection(o);
    if (!clientQuery.has(client)) {
      const query = client.query.bind(client);
      clientQuery.set(client, query);
      client.query = (...args: unknown[]) => {
        const config = args[0] as { text?: unknown; values?: unknown[] } | null;
        if (typeof config === "object" && config !== null && typeof config.text === "string")
          seen.push({ sql: config.text, bind: config.values ?? [] });
        return query(...args);
      };
    }
    return client;
  };
  const out: Record<string, CapturedStatement> = {};
  try {
    for (const search of DIRECTORY_SEARCHES) {
      seen.length = 0;
      const page = await searchDirectory(buyer, directoryQuerySchema.parse(search.query));
      const main = seen.find((s) => typeof s.sql === "string" && s.sql.includes("ORDER BY x.sort_key"));
      if (!main) throw new Error(`no directory statement captured for ${search.name}`);
      if (page.rows.length === 0)
        throw new Error(`directory search ${search.name} found nobody in the large data set`);
      out[search.name] = {
        sql: main.sql,
        bind: main.bind.map((v) => (v instanceof Date ? v.toISOString() : v)),
      };
    }
  } finally {
    (sequelize as unknown as { query: unknown }).query = original;
    manager.getConnection = getConnection;
    for (const [client, query] of clientQuery) client.query = query;
  }
  return out;
}

/** EXPLAIN (ANALYZE, BUFFERS) of each statement, run twice so the saved plan is the warm one. */
export async function explainStatements(
  url: string,
  statements: Record<string, CapturedStatement>,
  file: string,
): Promise<string> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  const parts: string[] = [];
  try {
    for (const [name, s] of Object.entries(statements)) {
      await client.query(`EXPLAIN (ANALYZE) ${s.sql}`, s.bind);
      const { rows } = await client.query<{ "QUERY PLAN": string }>(
        `EXPLAIN (ANALYZE, BUFFERS) ${s.sql}`,
        s.bind,
      );
      parts.push(
        `### ${name}\n${s.sql}\n-- bind: ${JSON.stringify(s.bind)}\n\n${rows.map((r) => r["QUERY PLAN"]).join("\n")}\n`,
      );
    }
  } finally {
    await client.end();
  }
  const text = parts.join("\n");
  await writeFile(file, text);
  return text;
}

/** Large tables read by a sequential scan anywhere in the saved plans (the hot path must have none). */
export function seqScansOfLargeTables(planText: string): string[] {
  const large = [
    "credentials",
    "technicians",
    "technician_standings",
    "work_orders",
    "job_reviews",
    "notices",
    "audit_events",
  ];
  const found = new Set<string>();
  for (const m of planText.matchAll(/Seq Scan on (\w+)/g)) if (large.includes(m[1]!)) found.add(m[1]!);
  return [...found];
}

export const explainFile = (dir: string, name: string) => path.join(dir, `explain-${name}.txt`);
