import { createHmac, timingSafeEqual } from "node:crypto";

/** How long a badge code is honoured; the badge page fetches a fresh one well before this. */
export const BADGE_TOKEN_TTL_MS = 5 * 60_000;

export type BadgeTokenCheck =
  | { state: "valid"; technicianId: number; issuedAt: Date }
  | { state: "expired"; technicianId: number; issuedAt: Date }
  | { state: "invalid" };

const encode = (b: Buffer) => b.toString("base64url");

function sign(secret: string, payload: string): Buffer {
  return createHmac("sha256", secret).update(`badge:${payload}`).digest();
}

/** A token naming the technician and the instant it was made; only the server's secret can make one that verifies. */
export function issueBadgeToken(secret: string, technicianId: number, now = new Date()): string {
  const payload = `${technicianId}.${now.getTime().toString(36)}`;
  return `${payload}.${encode(sign(secret, payload))}`;
}

export function checkBadgeToken(secret: string, token: string, now = new Date()): BadgeTokenCheck {
  const parts = token.split(".");
  if (parts.length !== 3) return { state: "invalid" };
  const [id, issued, mac] = parts as [string, string, string];
  if (!/^[1-9][0-9]{0,9}$/.test(id) || !/^[0-9a-z]{1,12}$/.test(issued)) return { state: "invalid" };
  const expected = sign(secret, `${id}.${issued}`);
  const given = Buffer.from(mac, "base64url");
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return { state: "invalid" };
  const issuedAt = new Date(parseInt(issued, 36));
  const technicianId = Number(id);
  const age = now.getTime() - issuedAt.getTime();
  // A small allowance for clocks a little ahead; anything older than the lifetime is a replayed screenshot.
  if (age > BADGE_TOKEN_TTL_MS || age < -30_000) return { state: "expired", technicianId, issuedAt };
  return { state: "valid", technicianId, issuedAt };
}

/** The code printed on a site's gate sign: names the site and cannot be made up for another one. */
export function siteGateCode(secret: string, siteId: number): string {
  const mac = createHmac("sha256", secret).update(`site:${siteId}`).digest();
  return `${siteId}-${encode(mac).slice(0, 10)}`;
}

export function siteFromGateCode(secret: string, code: string): number | null {
  const m = /^([1-9][0-9]{0,9})-[A-Za-z0-9_-]{10}$/.exec(code);
  if (!m) return null;
  const siteId = Number(m[1]);
  const expected = Buffer.from(siteGateCode(secret, siteId));
  const given = Buffer.from(code);
  return given.length === expected.length && timingSafeEqual(given, expected) ? siteId : null;
}
