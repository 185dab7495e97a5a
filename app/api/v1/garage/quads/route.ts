import { privateJson, route, routes } from "@/lib/http";
import { createQuad, listQuads } from "@/lib/garage/quads";

// The caller's own quads: list and add.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "user" }, async ({ user }) => privateJson({ quads: await listQuads(user.id) })),
  POST: route({ auth: "user", body: "json" }, async ({ user, body }) => privateJson({ quad: await createQuad(user.id, body) }, 201)),
});
