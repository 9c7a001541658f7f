import type { Sequelize, Transaction } from "sequelize";
import { selectRows } from "../server/db/sql.ts";

/** Fixed keys, one per job, so every server instance contends for the same lock (the bytes spell "clb" + job number). */
export const JOB_LOCK_KEYS = {
  lapse: 0x636c6201,
  reviewerDigest: 0x636c6202,
} as const;

export type Locked<T> = { skipped: true } | { skipped: false; value: T };

/**
 * Runs `work` in one transaction holding a PostgreSQL advisory lock on `key`, or skips at once when another instance
 * holds it. The transaction-scoped lock (pg_try_advisory_xact_lock) lives on the transaction's single connection for the
 * whole run and is released by COMMIT or ROLLBACK, so a crashed run can never leave it held.
 */
export async function withAdvisoryLock<T>(
  sequelize: Sequelize,
  key: number,
  work: (transaction: Transaction) => Promise<T>,
  onTransaction?: (transaction: Transaction) => void,
): Promise<Locked<T>> {
  return sequelize.transaction(async (transaction) => {
    onTransaction?.(transaction);
    const [row] = await selectRows<{ locked: boolean }>(
      transaction,
      "SELECT pg_try_advisory_xact_lock($1) AS locked",
      [key],
    );
    if (!row?.locked) return { skipped: true } as const;
    return { skipped: false, value: await work(transaction) } as const;
  });
}
