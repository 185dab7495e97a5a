import { methodNotAllowed, toApiError } from "./errors";
import { publicRead, type ApiGuard } from "./guard";
import { errorResponse } from "./respond";

// Route handlers stay thin: parse, call lib, return. apiRoute supplies the rest — the guard, and
// the promise that nothing escapes as a bare 500: whatever is thrown becomes the one error body.

export type RouteHandler<C> = (request: Request, context: C) => Promise<Response>;

export function apiRoute<C = unknown>(handler: RouteHandler<C>, options: { guard?: ApiGuard } = {}): RouteHandler<C> {
  const guard = options.guard ?? publicRead;
  return async (request, context) => {
    try {
      await guard(request);
      return await handler(request, context);
    } catch (error) {
      return errorResponse(toApiError(error, request));
    }
  };
}

/**
 * A handler for the methods a read-only route does not support: the JSON error body with an Allow
 * header (RFC 9110 §15.5.6), instead of the framework's empty 405. Export it as POST, PUT, PATCH
 * and DELETE beside GET.
 */
export function readOnly(allowed: readonly string[] = ["GET", "HEAD"]): RouteHandler<unknown> {
  return async (request) => errorResponse(methodNotAllowed(request.method, allowed), { Allow: allowed.join(", ") });
}
