import { privateJson, route, routes } from "@/lib/http";
import { listUsers, parseUsersQuery } from "@/lib/moderation";

// GET /api/v1/admin/users?page&role&q: people with their role, trust and record, 20 a page; q finds
// any part of a name or e-mail address. Admins only.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "admin", query: parseUsersQuery }, async ({ query }) => privateJson(await listUsers(query))),
});
