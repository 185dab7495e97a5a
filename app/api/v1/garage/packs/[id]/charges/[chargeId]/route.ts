import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { idFrom } from "@/lib/garage/owned";
import { deleteCharge } from "@/lib/garage/packs";
import { privateJson, requestUser } from "@/lib/submissions/http";

// Remove one mistaken charge from a pack's log; answers the pack as it now stands.
type Ctx = { params: Promise<{ id: string; chargeId: string }> };

export const DELETE = apiRoute<Ctx>(async (request, ctx) => {
  const { id, chargeId } = await ctx.params;
  return privateJson({ pack: await deleteCharge((await requestUser(request)).id, idFrom(id, "pack"), idFrom(chargeId, "charge")) });
}, { guard: signedIn });
