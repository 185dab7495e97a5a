import { privateJson, route, routes } from "@/lib/http";
import { listQueue, parseQueueParams } from "@/lib/moderation";

// GET /api/v1/moderation/queue?page&pageSize&sort&board&flag&age: one page of pending submissions,
// most serious first by default, with badge counts per flag. Moderators and admins.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "moderator", query: parseQueueParams }, async ({ query }) => privateJson(await listQueue(query))),
});
