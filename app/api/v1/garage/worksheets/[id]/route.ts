import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { idFrom } from "@/lib/garage/owned";
import { privateJson, requestUser } from "@/lib/submissions/http";
import { getRechargeWorksheet } from "@/lib/worksheets/recharge";

// One of the caller's worksheets, computed: iterations, next scale, roundings, stop rule, warnings.
type Ctx = { params: Promise<{ id: string }> };
export const GET = apiRoute<Ctx>(
  async (request, ctx) => privateJson({ worksheet: await getRechargeWorksheet((await requestUser(request)).id, idFrom((await ctx.params).id, "worksheet")) }),
  { guard: signedIn },
);
