import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";
import { startRechargeWorksheet } from "@/lib/worksheets/recharge";

// Start a fly-and-recharge worksheet on one of the caller's quads.
export const POST = apiRoute(
  async (request) => privateJson({ worksheet: await startRechargeWorksheet((await requestUser(request)).id, await readJsonBody(request)) }, 201),
  { guard: signedIn },
);
