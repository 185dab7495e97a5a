import { privateJson, route, routes } from "@/lib/http";
import { ownedIdParams } from "@/lib/garage/owned";
import { getWorksheet } from "@/lib/worksheets";

// One of the caller's worksheets of any kind, computed: what was entered, the next values, warnings.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "user", params: ownedIdParams("worksheet") }, async ({ user, params }) =>
    privateJson({ worksheet: await getWorksheet(user.id, params.id) }),
  ),
});
