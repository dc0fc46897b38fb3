// Typed errors: a code that maps to an HTTP status, and a message fit for a musician.
import type { FieldIssue } from "@/lib/validation/issues";

export type ErrorCode =
  | "bad_request"
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "payload_too_large"
  | "unsupported_media_type"
  | "unprocessable"
  | "rate_limited"
  | "payment_required"
  | "gone"
  | "unavailable";

const STATUS: Record<ErrorCode, number> = {
  bad_request: 400,
  unauthenticated: 401,
  payment_required: 402,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  rate_limited: 429,
  gone: 410,
  unavailable: 503,
};

export type { FieldIssue };

export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    /** Extra data for the client: field issues, the current row on a conflict … */
    readonly details?: { fields?: FieldIssue[]; current?: unknown; [k: string]: unknown },
  ) {
    super(message);
    this.name = "AppError";
  }
  get status(): number {
    return STATUS[this.code];
  }
}

export const notFound = (what = "That") => new AppError("not_found", `${what} was not found.`);
