import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { idFrom } from "@/lib/garage/owned";
import { deletePack, getPack, updatePack } from "@/lib/garage/packs";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";

// One of the caller's packs; anyone else's answers 404.
type Ctx = { params: Promise<{ id: string }> };
const id = async (ctx: Ctx) => idFrom((await ctx.params).id, "pack");

export const GET = apiRoute<Ctx>(async (request, ctx) => privateJson({ pack: await getPack((await requestUser(request)).id, await id(ctx)) }), { guard: signedIn });

export const PUT = apiRoute<Ctx>(
  async (request, ctx) => privateJson({ pack: await updatePack((await requestUser(request)).id, await id(ctx), await readJsonBody(request)) }),
  { guard: signedIn },
);

export const DELETE = apiRoute<Ctx>(async (request, ctx) => {
  await deletePack((await requestUser(request)).id, await id(ctx));
  return new Response(null, { status: 204, headers: { "Cache-Control": "no-store" } });
}, { guard: signedIn });
