import type { z } from "zod";
import {
  CSRF_HEADER,
  CSRF_HEADER_VALUE,
  errorBodySchema,
  type ErrorCode,
  type FieldProblem,
} from "@shared/api/error-body.ts";
import { env } from "@/config/env.ts";

/** An API answer that was not a success, carrying the server's code and per-field problems. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fields: readonly FieldProblem[] = [],
  ) {
    super(message);
    this.name = "ApiError";
  }
}

export const isApiError = (error: unknown): error is ApiError => error instanceof ApiError;

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

// Codes for answers whose body is not our error shape (a proxy page, an empty 502).
const fallbackCode = (status: number): ErrorCode =>
  status === 401
    ? "unauthenticated"
    : status === 403
      ? "forbidden"
      : status === 404
        ? "not_found"
        : status === 429
          ? "too_many_requests"
          : status === 502 || status === 503 || status === 504
            ? "unavailable"
            : "internal";

export async function toApiError(response: Response): Promise<ApiError> {
  const body: unknown = await response.json().catch(() => null);
  const parsed = errorBodySchema.safeParse(body);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiError(response.status, code, message, fields);
  }
  return new ApiError(
    response.status,
    fallbackCode(response.status),
    `The server answered ${response.status} ${response.statusText}`.trim(),
  );
}

async function request(method: Method, path: string, body?: unknown): Promise<Response> {
  const headers: Record<string, string> = { accept: "application/json" };
  if (body !== undefined) headers["content-type"] = "application/json";
  // Every state-changing request carries the header a cross-site form cannot set.
  if (method !== "GET") headers[CSRF_HEADER] = CSRF_HEADER_VALUE;
  let response: Response;
  try {
    response = await fetch(`${env.VITE_API_BASE}${path}`, {
      method,
      headers,
      credentials: "same-origin",
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(
      0,
      "unavailable",
      "Clearbench cannot be reached. Check your connection and try again.",
    );
  }
  if (!response.ok) throw await toApiError(response);
  return response;
}

async function readJson<S extends z.ZodType>(response: Response, schema: S): Promise<z.output<S>> {
  const parsed = schema.safeParse(await response.json().catch(() => undefined));
  if (!parsed.success)
    throw new ApiError(response.status, "internal", "The server sent an answer this page cannot read.");
  return parsed.data;
}

/** JSON over fetch: same-origin cookies, CSRF header on writes, typed errors, answers checked with zod. */
export const api = {
  get: async <S extends z.ZodType>(path: string, schema: S) => readJson(await request("GET", path), schema),
  post: async <S extends z.ZodType>(path: string, body: unknown, schema: S) =>
    readJson(await request("POST", path, body), schema),
  put: async <S extends z.ZodType>(path: string, body: unknown, schema: S) =>
    readJson(await request("PUT", path, body), schema),
  patch: async <S extends z.ZodType>(path: string, body: unknown, schema: S) =>
    readJson(await request("PATCH", path, body), schema),
  /** For answers without a body (202, 204). */
  send: async (method: Exclude<Method, "GET">, path: string, body?: unknown): Promise<void> => {
    await request(method, path, body);
  },
};
