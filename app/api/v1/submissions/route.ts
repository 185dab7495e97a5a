import { apiRoute, readOnly } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { createSubmission, listOwnSubmissions, parseIdempotencyKey } from "@/lib/submissions";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";

// POST /api/v1/submissions: a contribution with its evidence, as JSON, from a signed-in person.
// 201 with the stored submission (status 'pending'); a retry with the same Idempotency-Key and
// body gets the first 201 again (marked Idempotent-Replayed), the same key with another body a
// 422; a refused body a 400 whose fieldErrors are keyed by the form's field paths.
export const POST = apiRoute(
  async (request) => {
    const user = await requestUser(request);
    const key = parseIdempotencyKey(request.headers.get("idempotency-key"));
    const result = await createSubmission(user, await readJsonBody(request), { idempotencyKey: key });
    return privateJson(result.body, result.status, {
      Location: result.body.submission.links.self,
      ...(result.replayed ? { "Idempotent-Replayed": "true" } : {}),
    });
  },
  { guard: signedIn },
);

// GET /api/v1/submissions: the caller's own submissions, newest first.
export const GET = apiRoute(
  async (request) => {
    const user = await requestUser(request);
    return privateJson({ submissions: await listOwnSubmissions(user.id) });
  },
  { guard: signedIn },
);

const allowed = readOnly(["GET", "POST"]);
export const PUT = allowed;
export const PATCH = allowed;
export const DELETE = allowed;
