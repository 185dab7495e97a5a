import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { idFrom } from "@/lib/garage/owned";
import { privateJson, requestUser } from "@/lib/submissions/http";
import { removeWorksheetEntry } from "@/lib/worksheets";
import { positionFrom } from "@/lib/worksheets/shared";

// Take back the last iteration, voltage reading or bench point of an unpublished worksheet (position counts
// from 0 and must be the last one). The row is kept, marked as taken back; the answer carries it.
type Ctx = { params: Promise<{ id: string; position: string }> };
export const DELETE = apiRoute<Ctx>(async (request, ctx) => {
  const { id, position } = await ctx.params;
  const { worksheet, removed } = await removeWorksheetEntry((await requestUser(request)).id, idFrom(id, "worksheet"), positionFrom(position));
  return privateJson({ worksheet, removed });
}, { guard: signedIn });
