import { z } from "zod";
import { notFound, privateJson, route, routes } from "@/lib/http";
import { getUserSummary, updateUser } from "@/lib/moderation";

const UserParams = z.object({ id: z.string() });

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  // GET /api/v1/admin/users/{id}: one person's role, trust and record. Admins only.
  GET: route({ auth: "admin", params: UserParams }, async ({ params: { id } }) => {
    const user = await getUserSummary(id);
    if (!user) throw notFound(`There is no user with id ${id}.`, "id");
    return privateJson({ user });
  }),
  // PATCH /api/v1/admin/users/{id} with { role?, trusted?, reason? }: audited ('user_update'); the
  // role applies on the person's next request. 409 when it would leave the site without an admin.
  PATCH: route({ auth: "admin", params: UserParams, body: "json" }, async ({ user, params, body }) => privateJson(await updateUser(user, params.id, body))),
});
