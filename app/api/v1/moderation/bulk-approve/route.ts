import { privateJson, route, routes } from "@/lib/http";
import { bulkApprove } from "@/lib/moderation";

// POST /api/v1/moderation/bulk-approve with { items: [{ id, version }] }: approves each unflagged
// item in its own transaction; 200 with which were approved, which conflicted, which were refused.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "moderator", body: "json" }, async ({ user, body }) => privateJson(await bulkApprove(user, body))),
});
