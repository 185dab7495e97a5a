import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { idFrom, parseOrThrow } from "@/lib/garage/owned";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";
import { publishWorksheet } from "@/lib/worksheets";
import { publishInput } from "@/lib/worksheets/publish-input";

// "Publish to Shuntbook": the worksheet becomes a pending submission, moderated like any other;
// submission, evidence and link in one transaction, so a second publish is a 409 and adds nothing.
type Ctx = { params: Promise<{ id: string }> };
export const POST = apiRoute<Ctx>(async (request, ctx) => {
  const user = await requestUser(request);
  const id = idFrom((await ctx.params).id, "worksheet");
  const submission = await publishWorksheet(user.id, id, parseOrThrow(publishInput, await readJsonBody(request)));
  return privateJson({ submission }, 201);
}, { guard: signedIn });
