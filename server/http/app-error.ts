import type { ErrorCode, FieldProblem } from "../../shared/api/error-body.ts";

const STATUS: Record<ErrorCode, number> = {
  bad_request: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  gone: 410,
  too_large: 413,
  unsupported_type: 415,
  invalid_input: 422,
  too_many_requests: 429,
  unavailable: 503,
  internal: 500,
  transfer_required: 409,
};

export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: FieldProblem[],
  ) {
    super(message);
  }

  get status(): number {
    return STATUS[this.code];
  }
}

export const notFound = (what = "That record") => new AppError("not_found", `${what} was not found`);
