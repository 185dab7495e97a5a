import { z } from "zod";
import { privateJson, route, routes } from "@/lib/http";
import { ownedId } from "@/lib/garage/owned";
import { deleteCharge } from "@/lib/garage/packs";

// Remove one mistaken charge from a pack's log; answers the pack as it now stands.
const ChargeParams = z.object({ id: ownedId("pack"), chargeId: ownedId("charge") });

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  DELETE: route({ auth: "user", params: ChargeParams }, async ({ user, params }) =>
    privateJson({ pack: await deleteCharge(user.id, params.id, params.chargeId) }),
  ),
});
