import { ApiError } from "@/lib/api/errors";
import { readJsonBody as readJson } from "@/lib/api/json-body";
import { userFromRequest, type SessionUser } from "@/lib/auth";

// HTTP for the submission endpoints, so the route handlers stay thin: reading the JSON body,
// the caller, and the private (never cached) JSON answers of a mutation.

/** A submission with every section full is a few kB; this is far above it and bounds the parser. */
export const MAX_BODY_BYTES = 256 * 1024;

/** The request's JSON body (lib/api/json-body.ts), capped for a submission-sized document. */
export function readJsonBody(request: Request): Promise<unknown> {
  return readJson(request, MAX_BODY_BYTES);
}

/** The signed-in caller of a request (the route's signedIn guard has already checked there is one). */
export async function requestUser(request: Request): Promise<SessionUser> {
  const user = await userFromRequest(request);
  if (!user) throw new ApiError(401, "Sign in first: this needs a Shuntbook account.");
  return user;
}

// one implementation for every private answer; re-exported for the routes that import it from here
export { privateJson } from "@/lib/api/respond";
