import { QueryTypes, type Sequelize } from "sequelize";
import { newSequelize, readConnection } from "./sequelize.ts";

/**
 * An optional streaming replica for read-heavy pages that tolerate a little lag. Queries made through db() inside
 * readFromReplica() go to the replica; everything else (every write, every model call, every session) stays on the
 * primary. A replica that fails to answer is set aside for a while and the read is answered by the primary.
 */
let replica: Sequelize | undefined;
let downUntil = 0;

/** How long a replica that refused a connection is left alone before it is tried again. */
const RETRY_AFTER_MS = 5_000;

export function connectReplica(url: string, options: { poolMax?: number } = {}): Sequelize {
  replica = newSequelize(url, options);
  downUntil = 0;
  return replica;
}

export function replicaConfigured(): boolean {
  return replica !== undefined;
}

export async function closeReplica(): Promise<void> {
  const closing = replica;
  replica = undefined;
  await closing?.close();
}

function isConnectionFailure(err: unknown): boolean {
  const name = (err as { name?: string } | null)?.name ?? "";
  // Sequelize's connection errors (refused, timed out, host gone) and a replica shut down mid-query (57P01..57P03).
  if (name.startsWith("SequelizeConnection") || name === "SequelizeHostNotReachableError") return true;
  const parent = (err as { parent?: { code?: string; message?: string } }).parent;
  if (typeof parent?.code === "string" && /^(57P0[1-3]|08|ECONN)/.test(parent.code)) return true;
  // pg reports a socket closed under an idle pooled connection by message only.
  return /Connection terminated|ECONNRESET|ECONNREFUSED/.test(parent?.message ?? "");
}

/**
 * Runs a read-only piece of work against the replica when one is configured and answering; when it is not, or it
 * fails with a connection error part-way, the same work runs again on the primary (safe, because it only reads).
 */
export async function readFromReplica<T>(work: () => Promise<T>): Promise<T> {
  const target = replica;
  if (!target || Date.now() < downUntil) return work();
  try {
    return await readConnection.run(target, work);
  } catch (err) {
    if (!isConnectionFailure(err)) throw err;
    downUntil = Date.now() + RETRY_AFTER_MS;
    return work();
  }
}

export interface ReplicaHealth {
  replica: "up" | "down" | "none";
  /** Seconds since the last change replayed from the primary; 0 when the primary has written nothing since. */
  replicaLagSeconds?: number;
}

/** Whether the replica answers and how far behind it is; it never decides readiness (the primary serves without it). */
export async function replicaHealth(timeoutMs: number): Promise<ReplicaHealth> {
  const target = replica;
  if (!target) return { replica: "none" };
  let timer: NodeJS.Timeout | undefined;
  try {
    const rows = await Promise.race([
      target.query<{ lag: number | null }>(
        `SELECT CASE WHEN pg_last_wal_receive_lsn() = pg_last_wal_replay_lsn() THEN 0
                ELSE EXTRACT(EPOCH FROM now() - pg_last_xact_replay_timestamp())::float8 END AS lag`,
        { type: QueryTypes.SELECT },
      ),
      new Promise<never>((_, reject) => (timer = setTimeout(() => reject(new Error("timeout")), timeoutMs))),
    ]);
    downUntil = 0;
    return { replica: "up", replicaLagSeconds: Math.max(0, Math.round((rows[0]?.lag ?? 0) * 10) / 10) };
  } catch {
    return { replica: "down" };
  } finally {
    clearTimeout(timer);
  }
}

declare module "express-session" {
  interface SessionData {
    /** When this session last sent a write (ms since 1970): its reads stay on the primary for a while after. */
    wroteAt?: number;
  }
}

interface SessionLike {
  session?: { wroteAt?: number };
}

/**
 * Read-your-writes: a session that wrote in the last few seconds reads from the primary, so a buyer sees the site
 * they just saved even while the replica is a moment behind. Only kept when a replica is configured.
 */
export function noteWrite(req: SessionLike & { method: string; user?: unknown }): void {
  if (!replica || !req.user || !req.session) return;
  if (req.method === "GET" || req.method === "HEAD" || req.method === "OPTIONS") return;
  req.session.wroteAt = Date.now();
}

export function wroteRecently(req: SessionLike, seconds: number, now = Date.now()): boolean {
  const at = req.session?.wroteAt;
  return typeof at === "number" && now - at < seconds * 1000;
}
