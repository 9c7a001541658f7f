import bcrypt from "bcrypt";

let cost = 12;

/** Cost factor from config; 12 or more in production (OWASP password storage guidance, from memory). */
export function setPasswordCost(rounds: number): void {
  cost = rounds;
}

export const hashPassword = (password: string) => bcrypt.hash(password, cost);

// Compared against when the e-mail is unknown, so both answers take the same time.
const DUMMY_HASH = bcrypt.hashSync("clearbench-timing-equaliser", 12);

export async function checkPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return ok && Boolean(hash);
}
