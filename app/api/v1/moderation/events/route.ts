import { apiRoute, readOnly } from "@/lib/api/handler";
import { queryRecord } from "@/lib/api/query";
import { listAuditEvents, parseAuditQuery } from "@/lib/moderation";
import { moderatorOnly, privateJson } from "@/lib/moderation/http";

// GET /api/v1/moderation/events?page&pageSize&action&submission&user: the audit log, newest first.
export const GET = apiRoute(async (request) => privateJson(await listAuditEvents(parseAuditQuery(queryRecord(request)))), { guard: moderatorOnly });

const allowed = readOnly(["GET"]);
export const POST = allowed;
export const PUT = allowed;
export const PATCH = allowed;
export const DELETE = allowed;
