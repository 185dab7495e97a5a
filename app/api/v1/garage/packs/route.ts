import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { createPack, listPacks } from "@/lib/garage/packs";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";

// The caller's own packs, each with its charge log and suggested OSD warnings.
export const GET = apiRoute(async (request) => privateJson({ packs: await listPacks((await requestUser(request)).id) }), { guard: signedIn });

export const POST = apiRoute(
  async (request) => privateJson({ pack: await createPack((await requestUser(request)).id, await readJsonBody(request)) }, 201),
  { guard: signedIn },
);
