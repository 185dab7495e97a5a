import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { idFrom } from "@/lib/garage/owned";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";
import { addWorksheetEntry } from "@/lib/worksheets";

// Add one fly-and-recharge iteration, voltage reading or bench point (whichever the worksheet
// takes); stored whole or refused with field-level errors.
type Ctx = { params: Promise<{ id: string }> };
export const POST = apiRoute<Ctx>(
  async (request, ctx) =>
    privateJson({ worksheet: await addWorksheetEntry((await requestUser(request)).id, idFrom((await ctx.params).id, "worksheet"), await readJsonBody(request)) }, 201),
  { guard: signedIn },
);
