import { privateJson, route, routes } from "@/lib/http";
import { ownedIdParams } from "@/lib/garage/owned";
import { addCharge } from "@/lib/garage/packs";

// Log one charge of one of the caller's packs; answers the pack with its new warnings.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "user", params: ownedIdParams("pack"), body: "json" }, async ({ user, params, body }) =>
    privateJson({ pack: await addCharge(user.id, params.id, body) }, 201),
  ),
});
