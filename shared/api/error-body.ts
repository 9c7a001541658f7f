import { z } from "zod";

/** The one shape every API error takes on the wire. */
export const fieldProblemSchema = z.object({ path: z.string(), message: z.string() });
export type FieldProblem = z.infer<typeof fieldProblemSchema>;

export const errorCodes = [
  "bad_request",
  "unauthenticated",
  "forbidden",
  "not_found",
  "conflict",
  "gone",
  "too_large",
  "unsupported_type",
  "invalid_input",
  "too_many_requests",
  "unavailable",
  "internal",
  /** A 409 for a machine another shop holds: the answer is a transfer from that shop, not a second record. */
  "transfer_required",
] as const;
export type ErrorCode = (typeof errorCodes)[number];

export const errorBodySchema = z.object({
  error: z.object({
    code: z.enum(errorCodes),
    message: z.string(),
    fields: z.array(fieldProblemSchema).optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;

/** State-changing requests must carry this header; a cross-site form cannot set it. */
export const CSRF_HEADER = "x-clearbench-csrf";
export const CSRF_HEADER_VALUE = "1";
