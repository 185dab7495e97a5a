import { privateJson, route, routes } from "@/lib/http";
import { startWorksheet } from "@/lib/worksheets";

// Start a worksheet on one of the caller's quads: `kind` fly_recharge (the default), voltage or bench.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "user", body: "json" }, async ({ user, body }) => privateJson({ worksheet: await startWorksheet(user.id, body) }, 201)),
});
