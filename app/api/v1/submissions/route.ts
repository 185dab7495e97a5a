import { privateJson, route, routes } from "@/lib/http";
import { createSubmission, listOwnSubmissions, OwnListQuerySchema, parseIdempotencyKey } from "@/lib/submissions";

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  // POST /api/v1/submissions: a contribution with its evidence, as JSON, from a signed-in person.
  // 201 with the stored submission (status 'pending'); a retry with the same Idempotency-Key and
  // body gets the first 201 again (marked Idempotent-Replayed), the same key with another body a
  // 422; a refused body a 400 whose fieldErrors are keyed by the form's field paths.
  POST: route({ auth: "user", body: "json" }, async ({ req, user, body }) => {
    const idempotencyKey = parseIdempotencyKey(req.headers.get("idempotency-key"));
    const result = await createSubmission(user, body, { idempotencyKey });
    const replayed: Record<string, string> = result.replayed ? { "Idempotent-Replayed": "true" } : {};
    return privateJson(result.body, result.status, { Location: result.body.submission.links.self, ...replayed });
  }),
  // GET /api/v1/submissions?status&page&pageSize: a page of the caller's own submissions, newest
  // first, with counts per status.
  GET: route({ auth: "user", query: OwnListQuerySchema }, async ({ user, query }) => privateJson(await listOwnSubmissions(user.id, query))),
});
