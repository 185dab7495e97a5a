// Who may call an endpoint. Every handler made with apiRoute (lib/api/handler.ts) runs one guard
// before its body; the v1 read endpoints use publicRead. This is the seam for the role checks that
// come with sign-in: a `requireRole("moderator")` will be a guard that resolves the session and
// throws ApiError(401) without one or ApiError(403) with too small a role, e.g.
//
//   export const GET = apiRoute(handler, { guard: requireRole("moderator") });
//
// Guards throw; they never build responses, so the error shape stays the one in lib/api/respond.ts.

export type ApiGuard = (request: Request) => void | Promise<void>;

/** Anyone, signed in or not: the published catalogue and values are public. */
export const publicRead: ApiGuard = () => undefined;
