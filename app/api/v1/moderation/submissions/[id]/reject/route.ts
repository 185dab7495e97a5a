import { idParams, privateJson, route, routes } from "@/lib/http";
import { decide } from "@/lib/moderation";

// POST /api/v1/moderation/submissions/{id}/reject with { version, reason }: one transaction (status, board_stats,
// audit event, history, the contributor's mail). 409 "Someone else acted on this first" on a stale version.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "moderator", params: idParams("submission"), body: "json" }, async ({ user, params, body }) =>
    privateJson(await decide(user, params.id, "reject", body)),
  ),
});
