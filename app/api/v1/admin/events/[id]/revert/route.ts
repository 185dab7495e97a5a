import { apiRoute, readOnly } from "@/lib/api/handler";
import { revertEvent } from "@/lib/moderation";
import { adminOnly, parsePathId, privateJson, readJsonBody, requestUser, type IdContext } from "@/lib/moderation/http";

// POST /api/v1/admin/events/{id}/revert with { reason }: undoes a moderation decision as a new
// 'revert' event (nothing is deleted) and re-runs the statistics and history. Admins only.
export const POST = apiRoute<IdContext>(
  async (request, { params }) => {
    const actor = await requestUser(request);
    const id = parsePathId((await params).id, "audit event");
    return privateJson(await revertEvent(actor, id, await readJsonBody(request)));
  },
  { guard: adminOnly },
);

const allowed = readOnly(["POST"]);
export const GET = allowed;
export const PUT = allowed;
export const PATCH = allowed;
export const DELETE = allowed;
