import { noContent, privateJson, route, routes } from "@/lib/http";
import { ownedIdParams } from "@/lib/garage/owned";
import { deletePack, getPack, updatePack } from "@/lib/garage/packs";

// One of the caller's packs; anyone else's answers 404.
const params = ownedIdParams("pack");

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "user", params }, async ({ user, params }) => privateJson({ pack: await getPack(user.id, params.id) })),
  PUT: route({ auth: "user", params, body: "json" }, async ({ user, params, body }) => privateJson({ pack: await updatePack(user.id, params.id, body) })),
  DELETE: route({ auth: "user", params }, async ({ user, params }) => {
    // 204 when gone; 200 { archived: true } when a published worksheet keeps it (archived instead)
    const { archived } = await deletePack(user.id, params.id);
    return archived ? privateJson({ archived }) : noContent();
  }),
});
