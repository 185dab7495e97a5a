import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { idFrom } from "@/lib/garage/owned";
import { deleteQuad, getQuad, updateQuad } from "@/lib/garage/quads";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";

// One of the caller's quads; anyone else's answers 404.
type Ctx = { params: Promise<{ id: string }> };
const id = async (ctx: Ctx) => idFrom((await ctx.params).id, "quad");

export const GET = apiRoute<Ctx>(async (request, ctx) => privateJson({ quad: await getQuad((await requestUser(request)).id, await id(ctx)) }), { guard: signedIn });

export const PUT = apiRoute<Ctx>(
  async (request, ctx) => privateJson({ quad: await updateQuad((await requestUser(request)).id, await id(ctx), await readJsonBody(request)) }),
  { guard: signedIn },
);

export const DELETE = apiRoute<Ctx>(async (request, ctx) => {
  await deleteQuad((await requestUser(request)).id, await id(ctx));
  return new Response(null, { status: 204, headers: { "Cache-Control": "no-store" } });
}, { guard: signedIn });
