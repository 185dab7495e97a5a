import { apiRoute } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { createQuad, listQuads } from "@/lib/garage/quads";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";

// The caller's own quads: list and add.
export const GET = apiRoute(async (request) => privateJson({ quads: await listQuads((await requestUser(request)).id) }), { guard: signedIn });

export const POST = apiRoute(
  async (request) => privateJson({ quad: await createQuad((await requestUser(request)).id, await readJsonBody(request)) }, 201),
  { guard: signedIn },
);
