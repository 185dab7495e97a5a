import { refusedMidStream } from "./body-stream";
import { ApiError } from "./errors";
import { etagOf, ifNoneMatchHits } from "./etag";
import type { ErrorBody } from "./error-body";

// JSON responses for the API. Every success carries an ETag and Cache-Control; every error the one
// error body and `no-store`, so that a cache never keeps a 4xx/5xx for a URL that may work later.

/**
 * Shared caches and browsers may reuse a read for a minute and serve it stale for five more while
 * they revalidate (RFC 5861). Published values move only when a moderator approves something, so a
 * minute of lag is harmless, and revalidation with If-None-Match costs us almost nothing.
 */
const READ_CACHE_CONTROL = "public, max-age=60, stale-while-revalidate=300";
const ERROR_CACHE_CONTROL = "no-store";

const JSON_TYPE = "application/json; charset=utf-8";

// A public, read-only API: any site may read it from the browser. ETag is exposed so that such a
// client can revalidate.
const CORS_HEADERS = {
  "Access-Control-Allow-Origin": "*",
  "Access-Control-Expose-Headers": "ETag",
} as const;

function readHeaders(etag: string, cacheControl: string): Headers {
  return new Headers({ ...CORS_HEADERS, ETag: etag, "Cache-Control": cacheControl });
}

/** 304 with the validators a cache needs to refresh its stored copy (RFC 9110 §15.4.5). */
export function notModified(etag: string, cacheControl = READ_CACHE_CONTROL): Response {
  return new Response(null, { status: 304, headers: readHeaders(etag, cacheControl) });
}

/** 200 with a body already serialised, or 304 when the client already holds that tag. */
export function jsonWithEtag(request: Request, etag: string, body: string | (() => string), cacheControl = READ_CACHE_CONTROL): Response {
  if (ifNoneMatchHits(request.headers.get("if-none-match"), etag)) return notModified(etag, cacheControl);
  const headers = readHeaders(etag, cacheControl);
  headers.set("Content-Type", JSON_TYPE);
  return new Response(typeof body === "string" ? body : body(), { status: 200, headers });
}

/**
 * 200 with a body kept as bytes. Next compresses it on the way out when the client accepts gzip,
 * so the response depends on Accept-Encoding and says so in Vary (its 304s must say it too).
 */
export function varyingJson(etag: string, body: Uint8Array<ArrayBuffer>, cacheControl = READ_CACHE_CONTROL): Response {
  const headers = readHeaders(etag, cacheControl);
  headers.set("Content-Type", JSON_TYPE);
  headers.set("Vary", "Accept-Encoding");
  return new Response(body, { status: 200, headers });
}

/**
 * 200 for a body that is cheap to rebuild: serialised once, tagged by its hash, answered 304 when
 * the client's tag matches. The type parameter is the response schema's type, so a handler cannot
 * return a shape the OpenAPI document does not describe.
 */
export function jsonOk<T>(request: Request, body: T, cacheControl = READ_CACHE_CONTROL): Response {
  const text = JSON.stringify(body);
  return jsonWithEtag(request, etagOf(text), text, cacheControl);
}

function errorBody(error: ApiError): ErrorBody {
  return { error: { status: error.status, code: error.code, message: error.message, fieldErrors: error.fieldErrors } };
}

/**
 * After a body was refused part-way through, the rest of it is still on its way, unread
 * (lib/http/body-stream.ts): the connection is closed once the answer is out instead of kept
 * alive to drain it.
 */
const closeAfter = (error: ApiError): Record<string, string> => (refusedMidStream(error) ? { Connection: "close" } : {});

export function errorResponse(error: ApiError, extraHeaders: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(errorBody(error)), {
    status: error.status,
    headers: { ...CORS_HEADERS, "Content-Type": JSON_TYPE, "Cache-Control": ERROR_CACHE_CONTROL, ...closeAfter(error), ...error.headers, ...extraHeaders },
  });
}

/** A JSON answer for one signed-in person (an account, a submission, a decision): never cached. */
export function privateJson(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { "Content-Type": "application/json; charset=utf-8", "Cache-Control": "no-store", ...headers },
  });
}

/** 204 for a private write that has nothing to say (a deletion). */
export function noContent(): Response {
  return new Response(null, { status: 204, headers: { "Cache-Control": "no-store" } });
}

/** 429 in the one error shape, with Retry-After (RFC 6585 §4); `field` names what was limited. */
export function tooManyRequests(message: string, retryAfterSeconds: number, field = "email"): Response {
  return errorResponse(new ApiError(429, message, { [field]: [message] }), { "Retry-After": String(retryAfterSeconds) });
}
