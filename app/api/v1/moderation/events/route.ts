import { privateJson, route, routes } from "@/lib/http";
import { listAuditEvents, parseAuditQuery } from "@/lib/moderation";

// GET /api/v1/moderation/events?page&pageSize&action&submission&user: the audit log, newest first.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "moderator", query: parseAuditQuery }, async ({ query }) => privateJson(await listAuditEvents(query))),
});
