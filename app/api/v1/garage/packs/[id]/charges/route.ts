import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { idFrom } from "@/lib/garage/owned";
import { addCharge } from "@/lib/garage/packs";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";

// Log one charge of one of the caller's packs; answers the pack with its new warnings.
type Ctx = { params: Promise<{ id: string }> };

export const POST = apiRoute<Ctx>(
  async (request, ctx) =>
    privateJson({ pack: await addCharge((await requestUser(request)).id, idFrom((await ctx.params).id, "pack"), await readJsonBody(request)) }, 201),
  { guard: signedIn },
);
