import { pino, stdSerializers, type DestinationStream } from "pino";

/**
 * What never reaches a log line: session cookies, credentials in headers, passwords and one-time link tokens, wherever
 * they sit in a logged object. The serializers below also rebuild request and error objects from an allow-list, so a
 * header or an error property added later does not leak by default.
 */
export const REDACTED = "[Redacted]";
const SECRET_HEADERS = new Set(["cookie", "set-cookie", "authorization", "proxy-authorization", "x-api-key"]);
const SECRET_KEYS = /^(password|newPassword|passwordHash|token|sid|secret|cookie|authorization)$/i;
export const redactPaths = [
  "req.headers.cookie",
  "req.headers.authorization",
  'req.headers["proxy-authorization"]',
  'res.headers["set-cookie"]',
  "password",
  "token",
  "passwordHash",
  "*.password",
  "*.token",
  "*.passwordHash",
  "req.body.password",
  "req.body.token",
];

/** A URL's query values named like secrets (`?token=...`) replaced. */
export function redactUrl(url: string | undefined): string | undefined {
  if (!url || !url.includes("?")) return url;
  const [pathPart, query] = url.split("?", 2) as [string, string];
  const params = query
    .split("&")
    .map((pair) => {
      const name = decodeURIComponentSafe(pair.split("=", 1)[0] ?? "");
      return SECRET_KEYS.test(name) ? `${pair.split("=", 1)[0]}=${REDACTED}` : pair;
    })
    .join("&");
  return `${pathPart}?${params}`;
}

function decodeURIComponentSafe(s: string): string {
  try {
    return decodeURIComponent(s);
  } catch {
    return s;
  }
}

function redactHeaders(headers: Record<string, unknown> | undefined) {
  if (!headers) return headers;
  return Object.fromEntries(
    Object.entries(headers).map(([k, v]) => [k, SECRET_HEADERS.has(k.toLowerCase()) ? REDACTED : v]),
  );
}

type SerializedReq = { id?: unknown; method?: string; url?: string; headers?: Record<string, unknown> };
export function serializeReq(req: SerializedReq) {
  return { id: req.id, method: req.method, url: redactUrl(req.url), headers: redactHeaders(req.headers) };
}

export function serializeRes(res: { statusCode?: number; headers?: Record<string, unknown> }) {
  return { statusCode: res.statusCode, headers: redactHeaders(res.headers) };
}

// Sequelize and pg errors carry the statement and its bound values (a password hash, a token digest): left out.
const ERROR_NOISE = new Set([
  "sql",
  "parameters",
  "original",
  "parent",
  "bind",
  "config",
  "request",
  "response",
]);
export function serializeErr(err: unknown) {
  const plain = stdSerializers.err(err as Error) as unknown as Record<string, unknown>;
  if (!plain || typeof plain !== "object") return plain;
  return Object.fromEntries(
    Object.entries(plain).filter(([k]) => !ERROR_NOISE.has(k) && !SECRET_KEYS.test(k)),
  );
}

export const logSerializers = { req: serializeReq, res: serializeRes, err: serializeErr };

// Lines go to stdout; a test may point them elsewhere to read a whole run's log (setLogSink).
let sink: DestinationStream = pino.destination({ dest: 1, sync: true });
const forwarder: DestinationStream = { write: (line: string) => sink.write(line) };

export function setLogSink(next: DestinationStream | undefined): void {
  sink = next ?? pino.destination({ dest: 1, sync: true });
}

// The one logger. Its level is set from the validated config at start-up (configureLog).
export const log = pino(
  {
    level: "info",
    redact: { paths: redactPaths, censor: REDACTED },
    serializers: logSerializers,
  },
  forwarder,
);

export function configureLog(level: string): void {
  log.level = level;
}
