import { z } from "zod";
import { privateJson, route, routes } from "@/lib/http";
import { ownedId } from "@/lib/garage/owned";
import { deleteCharge, updateCharge } from "@/lib/garage/packs";

// Correct or remove one mistaken charge of a pack's log; answers the pack as it now stands.
const ChargeParams = z.object({ id: ownedId("pack"), chargeId: ownedId("charge") });

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  PUT: route({ auth: "user", params: ChargeParams, body: "json" }, async ({ user, params, body }) =>
    privateJson({ pack: await updateCharge(user.id, params.id, params.chargeId, body) }),
  ),
  DELETE: route({ auth: "user", params: ChargeParams }, async ({ user, params }) =>
    privateJson({ pack: await deleteCharge(user.id, params.id, params.chargeId) }),
  ),
});
