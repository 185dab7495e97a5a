import { privateJson, route, routes } from "@/lib/http";
import { ownedIdParams, parseOrThrow } from "@/lib/garage/owned";
import { publishWorksheet } from "@/lib/worksheets";
import { publishInput } from "@/lib/worksheets/publish-input";

// "Publish to Shuntbook": the worksheet becomes a pending submission, moderated like any other;
// submission, evidence and link in one transaction, so a second publish is a 409 and adds nothing.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "user", params: ownedIdParams("worksheet"), body: "json" }, async ({ user, params, body }) =>
    privateJson({ submission: await publishWorksheet(user.id, params.id, parseOrThrow(publishInput, body)) }, 201),
  ),
});
