import { privateJson, route, routes } from "@/lib/http";
import { ownedIdParams } from "@/lib/garage/owned";
import { addWorksheetEntry } from "@/lib/worksheets";

// Add one fly-and-recharge iteration, voltage reading or bench point (whichever the worksheet
// takes); stored whole or refused with field-level errors.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "user", params: ownedIdParams("worksheet"), body: "json" }, async ({ user, params, body }) =>
    privateJson({ worksheet: await addWorksheetEntry(user.id, params.id, body) }, 201),
  ),
});
