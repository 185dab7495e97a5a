import { apiRoute, readOnly } from "@/lib/api/handler";
import { queryRecord } from "@/lib/api/query";
import { listQueue, parseQueueParams } from "@/lib/moderation";
import { moderatorOnly, privateJson } from "@/lib/moderation/http";

// GET /api/v1/moderation/queue?page&pageSize&sort&board&flag&age: one page of pending submissions,
// most serious first by default, with badge counts per flag. Moderators and admins.
export const GET = apiRoute(async (request) => privateJson(await listQueue(parseQueueParams(queryRecord(request)))), { guard: moderatorOnly });

const allowed = readOnly(["GET"]);
export const POST = allowed;
export const PUT = allowed;
export const PATCH = allowed;
export const DELETE = allowed;
