import { apiRoute, readOnly } from "@/lib/api/handler";
import { queryRecord } from "@/lib/api/query";
import { listUsers, parseUsersQuery } from "@/lib/moderation";
import { adminOnly, privateJson } from "@/lib/moderation/http";

// GET /api/v1/admin/users?page&role: people with their role, trust and record. Admins only.
export const GET = apiRoute(async (request) => privateJson(await listUsers(parseUsersQuery(queryRecord(request)))), { guard: adminOnly });

const allowed = readOnly(["GET"]);
export const POST = allowed;
export const PUT = allowed;
export const PATCH = allowed;
export const DELETE = allowed;
