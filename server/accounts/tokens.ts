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

/** Whether a link is still usable, without using it: read before any password is hashed for it. */
export async function isUsableToken(token: string): Promise<boolean> {
  const found = await OneTimeToken.findOne({
    where: { tokenHash: digest(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
    attributes: ["id"],
  });
  return found !== null;
}

/** Every other outstanding link of the user stops working (a reset or invitation already used one). */
export async function revokeOutstandingTokens(userId: number, transaction: Transaction): Promise<number> {
  const [count] = await OneTimeToken.update(
    { usedAt: new Date() },
    { where: { userId, usedAt: null, expiresAt: { [Op.gt]: new Date() } }, transaction },
  );
  return count;
}

/** A reset link was issued to the user within the last `minutes` (whether or not it was used). */
export async function resetIssuedWithin(userId: number, minutes: number, transaction: Transaction) {
  if (minutes <= 0) return false;
  const found = await OneTimeToken.findOne({
    where: { userId, purpose: "reset", createdAt: { [Op.gt]: new Date(Date.now() - minutes * 60_000) } },
    attributes: ["id"],
    transaction,
  });
  return found !== null;
}
