import bcrypt from "bcrypt";
import { HashSlots } from "./hash-slots.ts";

let cost = 12;
const slots = new HashSlots(2, 16);

/** Cost factor from config; 12 or more in production (OWASP password storage guidance, from memory). */
export function setPasswordCost(rounds: number): void {
  cost = rounds;
}

/** How many hashes and comparisons may run at once, and how many may wait (from config). */
export function setHashConcurrency(concurrent: number, queued: number): void {
  slots.resize(concurrent, queued);
}

export const hashSlotStats = () => slots.stats;

export const hashPassword = (password: string) => slots.run(() => bcrypt.hash(password, cost));

// Compared against when the e-mail is unknown, so both answers take the same time: made at the configured cost, once.
const dummyHashes = new Map<number, string>();
function dummyHash(): string {
  let hash = dummyHashes.get(cost);
  if (!hash) {
    hash = bcrypt.hashSync("clearbench-timing-equaliser", cost);
    dummyHashes.set(cost, hash);
  }
  return hash;
}

export async function checkPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const against = hash ?? dummyHash();
  const ok = await slots.run(() => bcrypt.compare(password, against));
  return ok && Boolean(hash);
}
