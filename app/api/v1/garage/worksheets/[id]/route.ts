import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { idFrom } from "@/lib/garage/owned";
import { privateJson, requestUser } from "@/lib/submissions/http";
import { getWorksheet } from "@/lib/worksheets";

// One of the caller's worksheets of any kind, computed: what was entered, the next values, warnings.
type Ctx = { params: Promise<{ id: string }> };
export const GET = apiRoute<Ctx>(
  async (request, ctx) => privateJson({ worksheet: await getWorksheet((await requestUser(request)).id, idFrom((await ctx.params).id, "worksheet")) }),
  { guard: signedIn },
);
