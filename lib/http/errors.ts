import { ConnectionAcquireTimeoutError, ConnectionError, ForeignKeyConstraintError, TimeoutError } from "sequelize";

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
  /** Headers the error response carries besides the usual ones (Retry-After on a 503). */
  headers: Record<string, string> = {};

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
// client may retry, so it is a 503 with Retry-After (RFC 9110 §10.2.3), not a 500. Sequelize
// raises a lost connection as ConnectionError (or a subclass) when it sees it first, but as a
// plain DatabaseError when PostgreSQL said so on a live connection: those carry SQLSTATE class 08
// (connection exception), 57P01–57P03 (shutdown, crash recovery, not yet accepting) or 53300
// (too many connections) (PostgreSQL 15 manual, Appendix A "Error Codes").
const UNAVAILABLE = [ConnectionError, ConnectionAcquireTimeoutError, TimeoutError];
const UNAVAILABLE_STATES = /^(08...|57P0[123]|53300)$/;
// node-postgres's own errors for a connection that died under a query carry no SQLSTATE, only
// these messages (pg 8 lib/client.js), and Sequelize wraps them as a DatabaseError
const LOST_CONNECTION =
  /^(Client has encountered a connection error and is not queryable|Connection terminated( unexpectedly)?|Client was closed and is not queryable)$/;

function lostConnection(error: unknown): boolean {
  const messages = [error, (error as { parent?: unknown })?.parent].map((e) => (e instanceof Error ? e.message : ""));
  return messages.some((m) => LOST_CONNECTION.test(m));
}
/** Seconds a client should wait before retrying: a restart of the local cluster takes a few. */
const UNAVAILABLE_RETRY_AFTER_SECONDS = 5;

/** The SQLSTATE of a pg error, whether thrown as is or wrapped by Sequelize (parent/original). */
function sqlState(error: unknown): string | null {
  for (const e of [error, (error as { parent?: unknown })?.parent, (error as { original?: unknown })?.original]) {
    const code = (e as { code?: unknown } | null | undefined)?.code;
    if (typeof code === "string" && /^[0-9A-Z]{5}$/.test(code)) return code;
  }
  return null;
}

const camel = (column: string) => column.replace(/_([a-z])/g, (_, c: string) => c.toUpperCase());

/** The field a foreign-key error is about, in the API's camelCase ("board_revision_id" → "boardRevisionId"). */
function foreignKeyField(error: ForeignKeyConstraintError): string {
  const fields = error.fields as unknown;
  const first = Array.isArray(fields) ? fields[0] : fields && typeof fields === "object" ? Object.keys(fields)[0] : undefined;
  return typeof first === "string" ? camel(first) : "body";
}

function serviceUnavailable(): ApiError {
  const error = new ApiError(503, "The catalogue database is not reachable right now. Try again in a moment.");
  error.headers = { "Retry-After": String(UNAVAILABLE_RETRY_AFTER_SECONDS) };
  return error;
}

/**
 * Maps anything thrown in a handler to an ApiError. Input the database refused (a row id that
 * names nothing, a number or date it cannot hold: SQLSTATE 23503 and class 22) is a 400 even when
 * lib did not check it first; lib checks what it can and names the field, this is the backstop.
 * Unexpected errors are logged here (with the method and path, never the body) and reach the
 * client only as a generic 500 message.
 */
export function toApiError(error: unknown, request?: Request): ApiError {
  if (error instanceof ApiError) return error;
  const where = request ? `${request.method} ${new URL(request.url).pathname}` : "API";
  const state = sqlState(error);
  if (UNAVAILABLE.some((type) => error instanceof type) || (state && UNAVAILABLE_STATES.test(state)) || lostConnection(error)) {
    console.error(`[api] ${where}: database unavailable`, error instanceof Error ? error.message : error);
    return serviceUnavailable();
  }
  if (error instanceof ForeignKeyConstraintError || state === "23503") {
    const field = error instanceof ForeignKeyConstraintError ? foreignKeyField(error) : "body";
    console.error(`[api] ${where}: foreign key refused (${field})`);
    return badRequest({ [field]: ["This names something that does not exist: choose it from the list"] });
  }
  if (state?.startsWith("22")) {
    console.error(`[api] ${where}: data refused by the database (${state})`);
    return badRequest({ body: ["A value is outside what can be stored (a number too large, a date out of range or a character not allowed)"] });
  }
  console.error(`[api] ${where}: unexpected error`, error);
  return new ApiError(500, "Something went wrong on our side. It has been logged; try again later.");
}
