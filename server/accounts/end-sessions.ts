import { QueryTypes, type Transaction } from "sequelize";
import { db } from "../db/sequelize.ts";

/**
 * Deletes the user's rows of the `session` table (connect-pg-simple keeps passport's user id at sess.passport.user),
 * except the session of the request that made the change. A sequential scan of the table: this runs on a password
 * change only, and the table holds one row per live session.
 */
export async function endSessionsOfUser(
  userId: number,
  keepSessionId: string | undefined,
  transaction?: Transaction,
): Promise<number> {
  const rows = await db().query<{ sid: string }>(
    `DELETE FROM "session"
      WHERE (sess #>> '{passport,user}') = :userId AND sid <> :keep
      RETURNING sid`,
    {
      replacements: { userId: String(userId), keep: keepSessionId ?? "" },
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return rows.length;
}
