import { withoutLoneSurrogates } from "../../shared/api/text.ts";

/**
 * multer (busboy) reads a multipart file name as latin1, while browsers and HTTP clients send UTF-8 bytes: "Müller"
 * arrives as "MÃ¼ller". The bytes are read back as UTF-8; a name whose bytes are not valid UTF-8 (a client that really
 * sent latin1) is kept as it came.
 */
export function utf8FileName(received: string): string {
  // Only a name made entirely of latin1 code points can be UTF-8 bytes read as latin1.
  const latin1Only = [...received].every((c) => c.charCodeAt(0) <= 0xff);
  if (!latin1Only || !/[\u0080-\u00ff]/.test(received)) return received;
  const decoded = Buffer.from(received, "latin1").toString("utf8");
  return decoded.includes("\uFFFD") ? received : decoded;
}

// RFC 5987 attr-char: ALPHA / DIGIT / "!#$&+-.^_`|~"; everything else percent-encoded as UTF-8.
const encodeRfc5987 = (s: string) =>
  encodeURIComponent(s).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);

/**
 * A Content-Disposition value (RFC 6266) carrying the name twice: `filename*` in UTF-8 (RFC 5987) for every current
 * client, and an ASCII `filename` fallback for old ones.
 */
export function contentDisposition(disposition: "inline" | "attachment", name: string): string {
  const wellFormed = withoutLoneSurrogates(name);
  const ascii = wellFormed.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return `${disposition}; filename="${ascii}"; filename*=UTF-8''${encodeRfc5987(wellFormed)}`;
}
