import { ConnectionAcquireTimeoutError, ConnectionError, TimeoutError } from "sequelize";

// The one error type of the JSON API. Route handlers throw it (or let lib code throw anything
// else); route() in lib/http/route.ts turns whatever was thrown into the one error body via toApiError.

export const ERROR_CODES = {
  400: "bad_request",
  401: "unauthorized",
  403: "forbidden",
  404: "not_found",
  405: "method_not_allowed",
  // a stale version or a state that no longer allows the change (RFC 9110 §15.5.10)
  409: "conflict",
  // a body past its endpoint's size cap, refused while it streams (RFC 9110 §15.5.14)
  413: "content_too_large",
  // well-formed but refused, e.g. an Idempotency-Key reused with a different body (RFC 9110 §15.5.21)
  422: "unprocessable_content",
  // a rate limit (sign-in, password reset); sent with Retry-After (RFC 6585 §4)
  429: "too_many_requests",
  500: "internal_error",
  503: "service_unavailable",
} as const;

export type ApiErrorStatus = keyof typeof ERROR_CODES;
export type ApiErrorCode = (typeof ERROR_CODES)[ApiErrorStatus];
/** Messages per query or path parameter, keyed by the parameter's name as the client sent it. */
export type FieldErrors = Record<string, string[]>;

export class ApiError extends Error {
  readonly code: ApiErrorCode;

  constructor(
    readonly status: ApiErrorStatus,
    message: string,
    readonly fieldErrors: FieldErrors = {},
  ) {
    super(message);
    this.name = "ApiError";
    this.code = ERROR_CODES[status];
  }
}

/** 400 naming each bad parameter; the message lists them so a human reading only it knows which. */
export function badRequest(fieldErrors: FieldErrors): ApiError {
  const fields = Object.keys(fieldErrors);
  const message = fields.length
    ? `Bad ${fields.length === 1 ? "parameter" : "parameters"}: ${fields.join(", ")}. See fieldErrors.`
    : "The request could not be read.";
  return new ApiError(400, message, fieldErrors);
}

/**
 * 413 for a body past `maxBytes`, named by `field` ("body", or the upload's "file"); the message
 * says the cap so a client knows how far to shrink.
 */
export function contentTooLarge(message: string, field = "body"): ApiError {
  return new ApiError(413, message, { [field]: [message] });
}

/** 404 for something the client named that does not exist; `field` says which parameter named it. */
export function notFound(message: string, field?: string): ApiError {
  return new ApiError(404, message, field ? { [field]: [message] } : {});
}

export function methodNotAllowed(method: string, allowed: readonly string[]): ApiError {
  return new ApiError(405, `${method} is not supported here; use ${allowed.join(" or ")}.`);
}

// The database being unreachable or saturated is not a bug in the request or in our code: the
// client may retry, so it is a 503, not a 500.
const UNAVAILABLE = [ConnectionError, ConnectionAcquireTimeoutError, TimeoutError];

/**
 * Maps anything thrown in a handler to an ApiError. Unexpected errors are logged here (with the
 * method and path, never the body) and reach the client only as a generic 500 message.
 */
export function toApiError(error: unknown, request?: Request): ApiError {
  if (error instanceof ApiError) return error;
  const where = request ? `${request.method} ${new URL(request.url).pathname}` : "API";
  if (UNAVAILABLE.some((type) => error instanceof type)) {
    console.error(`[api] ${where}: database unavailable`, error);
    return new ApiError(503, "The catalogue database is not reachable right now. Try again in a moment.");
  }
  console.error(`[api] ${where}: unexpected error`, error);
  return new ApiError(500, "Something went wrong on our side. It has been logged; try again later.");
}
