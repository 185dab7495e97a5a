import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { idFrom } from "@/lib/garage/owned";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";
import { publishRechargeWorksheet } from "@/lib/worksheets/recharge";

// "Publish to Shuntbook": the worksheet becomes a pending submission, moderated like any other.
type Ctx = { params: Promise<{ id: string }> };
export const POST = apiRoute<Ctx>(async (request, ctx) => {
  const body = (await readJsonBody(request)) as { firmwareVersion?: string | null; notes?: string | null } | null;
  const submission = await publishRechargeWorksheet((await requestUser(request)).id, idFrom((await ctx.params).id, "worksheet"), {
    firmwareVersion: typeof body?.firmwareVersion === "string" ? body.firmwareVersion : null,
    notes: typeof body?.notes === "string" ? body.notes : null,
  });
  return privateJson({ submission }, 201);
}, { guard: signedIn });
