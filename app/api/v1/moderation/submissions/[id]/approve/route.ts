import { readOnly } from "@/lib/api/handler";
import { decisionRoute } from "@/lib/moderation/http";

// POST /api/v1/moderation/submissions/{id}/approve with { version, note? }: one transaction (status, board_stats,
// audit event, history, the contributor's mail). 409 "Someone else acted on this first" on a stale version.
export const POST = decisionRoute("approve");

const allowed = readOnly(["POST"]);
export const GET = allowed;
export const PUT = allowed;
export const PATCH = allowed;
export const DELETE = allowed;
