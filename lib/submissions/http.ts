import { ApiError, badRequest } from "@/lib/api/errors";
import { userFromRequest, type SessionUser } from "@/lib/auth";

// HTTP for the submission endpoints, so the route handlers stay thin: reading the JSON body,
// the caller, and the private (never cached) JSON answers of a mutation.

/** A submission with every section full is a few kB; this is far above it and bounds the parser. */
export const MAX_BODY_BYTES = 256 * 1024;

/**
 * The request's JSON body. It must say Content-Type: application/json: besides being honest, that
 * makes a cross-site request from a form or a plain fetch a preflighted one, which this API never
 * grants, so another site cannot post a submission with a visitor's cookie.
 */
export async function readJsonBody(request: Request): Promise<unknown> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^application\/json\s*(;|$)/i.test(type)) {
    throw badRequest({ "Content-Type": ["Send the submission as JSON, with Content-Type: application/json"] });
  }
  const announced = Number(request.headers.get("content-length"));
  if (Number.isFinite(announced) && announced > MAX_BODY_BYTES) throw badRequest({ body: [`The body is larger than ${MAX_BODY_BYTES / 1024} kB`] });
  const text = await request.text();
  if (text.length > MAX_BODY_BYTES) throw badRequest({ body: [`The body is larger than ${MAX_BODY_BYTES / 1024} kB`] });
  try {
    return JSON.parse(text);
  } catch {
    throw badRequest({ body: ["The body is not valid JSON"] });
  }
}

/** The signed-in caller of a request (the route's signedIn guard has already checked there is one). */
export async function requestUser(request: Request): Promise<SessionUser> {
  const user = await userFromRequest(request);
  if (!user) throw new ApiError(401, "Sign in first: this needs a Shuntbook account.");
  return user;
}

const PRIVATE_HEADERS = { "Content-Type": "application/json; charset=utf-8", "Cache-Control": "no-store" } as const;

/** A JSON answer for one signed-in person: never stored by any cache. */
export function privateJson(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), { status, headers: { ...PRIVATE_HEADERS, ...headers } });
}
