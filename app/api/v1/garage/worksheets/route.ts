import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";
import { startWorksheet } from "@/lib/worksheets";

// Start a worksheet on one of the caller's quads: `kind` fly_recharge (the default), voltage or bench.
export const POST = apiRoute(
  async (request) => privateJson({ worksheet: await startWorksheet((await requestUser(request)).id, await readJsonBody(request)) }, 201),
  { guard: signedIn },
);
