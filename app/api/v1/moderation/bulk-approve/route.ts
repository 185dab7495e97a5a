import { apiRoute, readOnly } from "@/lib/api/handler";
import { bulkApprove } from "@/lib/moderation";
import { moderatorOnly, privateJson, readJsonBody, requestUser } from "@/lib/moderation/http";

// POST /api/v1/moderation/bulk-approve with { items: [{ id, version }] }: approves each unflagged
// item in its own transaction; 200 with which were approved, which conflicted, which were refused.
export const POST = apiRoute(
  async (request) => {
    const actor = await requestUser(request);
    return privateJson(await bulkApprove(actor, await readJsonBody(request)));
  },
  { guard: moderatorOnly },
);

const allowed = readOnly(["POST"]);
export const GET = allowed;
export const PUT = allowed;
export const PATCH = allowed;
export const DELETE = allowed;
