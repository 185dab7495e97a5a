import { idParams, privateJson, route, routes } from "@/lib/http";
import { revertEvent } from "@/lib/moderation";

// POST /api/v1/admin/events/{id}/revert with { reason }: undoes a moderation decision as a new
// 'revert' event (nothing is deleted) and re-runs the statistics and history. Admins only.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "admin", params: idParams("audit event"), body: "json" }, async ({ user, params, body }) =>
    privateJson(await revertEvent(user, params.id, body)),
  ),
});
