import { idParams, notFound, privateJson, route, routes } from "@/lib/http";
import { getOwnSubmission, updateSubmission } from "@/lib/submissions";

const params = idParams("submission");

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  // GET /api/v1/submissions/{id}: one of the caller's own submissions (anyone else's is a 404).
  GET: route({ auth: "user", params }, async ({ user, params: { id } }) => {
    const submission = await getOwnSubmission(user.id, id);
    if (!submission) throw notFound(`There is no submission with id ${id}.`, "id");
    return privateJson({ submission });
  }),
  // PATCH /api/v1/submissions/{id}: the whole submission again plus the `version` it was edited
  // from. Owner only (403), only while pending or changes requested (409), and 409 on a stale version.
  PATCH: route({ auth: "user", params, body: "json" }, async ({ user, params, body }) =>
    privateJson({ submission: await updateSubmission(user, params.id, body) }),
  ),
});
