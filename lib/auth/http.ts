import type { z } from "zod";
import { badRequest } from "@/lib/api/errors";
import { fieldErrorsOf } from "@/lib/api/query";

// Request bodies of the account endpoints (/api/auth/sign-up, password-reset, profile). JSON
// only: a cross-site page can send a form or a plain-text POST without asking, but not
// application/json, so insisting on it keeps other sites from posting with a visitor's cookie.

const MAX_BODY_BYTES = 8 * 1024;

export async function readBody<S extends z.ZodType>(request: Request, schema: S): Promise<z.output<S>> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^application\/json\s*(;|$)/i.test(type)) throw badRequest({ "Content-Type": ["Send the form as JSON, with Content-Type: application/json."] });
  const text = await request.text();
  if (text.length > MAX_BODY_BYTES) throw badRequest({ body: [`The body is larger than ${MAX_BODY_BYTES / 1024} kB.`] });
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw badRequest({ body: ["The body is not valid JSON."] });
  }
  const parsed = schema.safeParse(json);
  if (!parsed.success) throw badRequest(fieldErrorsOf(parsed.error.issues, "body"));
  return parsed.data;
}

const JSON_HEADERS = { "Content-Type": "application/json; charset=utf-8", "Cache-Control": "no-store" } as const;

/** An answer about one person's account: never cached. */
export function accountJson(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), { status, headers: { ...JSON_HEADERS, ...headers } });
}

/** 429 in the API's one error shape, with Retry-After (RFC 6585 §4). */
export function tooManyRequests(message: string, retryAfterSeconds: number, field = "email"): Response {
  const body = { error: { status: 429, code: "too_many_requests", message, fieldErrors: { [field]: [message] } } };
  return new Response(JSON.stringify(body), { status: 429, headers: { ...JSON_HEADERS, "Retry-After": String(retryAfterSeconds) } });
}
