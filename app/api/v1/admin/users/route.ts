import { privateJson, route, routes } from "@/lib/http";
import { listUsers, parseUsersQuery } from "@/lib/moderation";

// GET /api/v1/admin/users?page&role: people with their role, trust and record. Admins only.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "admin", query: parseUsersQuery }, async ({ query }) => privateJson(await listUsers(query))),
});
