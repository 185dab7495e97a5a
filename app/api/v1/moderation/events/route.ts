import { privateJson, route, routes } from "@/lib/http";
import { listAuditEvents, parseAuditQuery } from "@/lib/moderation";

// GET /api/v1/moderation/events?page&pageSize&action&submission&user: the audit log, newest first;
// each event's `revertable` says whether the caller's revert would succeed now (an admin's, who
// cannot revert decisions on their own submissions; a moderator cannot revert at all).
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "moderator", query: parseAuditQuery }, async ({ query, user }) => privateJson(await listAuditEvents(query, user))),
});
