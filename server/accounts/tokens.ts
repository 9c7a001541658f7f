import { createHash, randomBytes } from "node:crypto";
import { Op, type Transaction } from "sequelize";
import { OneTimeToken } from "./model.ts";

const RESET_TTL_MS = 60 * 60_000; // one hour for a reset link
const INVITE_TTL_MS = 7 * 24 * 60 * 60_000; // a week to accept an invitation

const digest = (token: string) => createHash("sha256").update(token).digest("hex");

export async function issueToken(
  userId: number,
  purpose: "reset" | "invite",
  transaction?: Transaction,
): Promise<string> {
  const token = randomBytes(32).toString("base64url");
  const ttl = purpose === "reset" ? RESET_TTL_MS : INVITE_TTL_MS;
  await OneTimeToken.create(
    { userId, purpose, tokenHash: digest(token), expiresAt: new Date(Date.now() + ttl) },
    { transaction },
  );
  return token;
}

/** Marks the token used in one statement, so two requests with the same link cannot both succeed. */
export async function consumeToken(token: string, transaction: Transaction): Promise<number | null> {
  const [count, rows] = await OneTimeToken.update(
    { usedAt: new Date() },
    {
      where: { tokenHash: digest(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
      returning: true,
      transaction,
    },
  );
  return count === 1 && rows[0] ? rows[0].userId : null;
}
