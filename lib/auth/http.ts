import type { z } from "zod";
import { ApiError, badRequest } from "@/lib/api/errors";
import { fieldErrorsOf } from "@/lib/api/query";
import { readJsonBody } from "@/lib/api/json-body";
import { errorResponse } from "@/lib/api/respond";

// Request bodies of the account endpoints (/api/auth/sign-up, password-reset, profile). JSON
// only: a cross-site page can send a form or a plain-text POST without asking, but not
// application/json, so insisting on it keeps other sites from posting with a visitor's cookie.

const MAX_BODY_BYTES = 8 * 1024;

export async function readBody<S extends z.ZodType>(request: Request, schema: S): Promise<z.output<S>> {
  const parsed = schema.safeParse(await readJsonBody(request, MAX_BODY_BYTES));
  if (!parsed.success) throw badRequest(fieldErrorsOf(parsed.error.issues, "body"));
  return parsed.data;
}

/** An answer about one person's account: never cached. */
export { privateJson as accountJson } from "@/lib/api/respond";

/** 429 in the API's one error shape, with Retry-After (RFC 6585 §4). */
export function tooManyRequests(message: string, retryAfterSeconds: number, field = "email"): Response {
  return errorResponse(new ApiError(429, message, { [field]: [message] }), { "Retry-After": String(retryAfterSeconds) });
}
