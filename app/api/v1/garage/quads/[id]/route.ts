import { noContent, privateJson, route, routes } from "@/lib/http";
import { ownedIdParams } from "@/lib/garage/owned";
import { deleteQuad, getQuad, updateQuad } from "@/lib/garage/quads";

// One of the caller's quads; anyone else's answers 404.
const params = ownedIdParams("quad");

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "user", params }, async ({ user, params }) => privateJson({ quad: await getQuad(user.id, params.id) })),
  PUT: route({ auth: "user", params, body: "json" }, async ({ user, params, body }) => privateJson({ quad: await updateQuad(user.id, params.id, body) })),
  DELETE: route({ auth: "user", params }, async ({ user, params }) => {
    // 204 when gone; 200 { archived: true } when a published worksheet keeps it (archived instead)
    const { archived } = await deleteQuad(user.id, params.id);
    return archived ? privateJson({ archived }) : noContent();
  }),
});
