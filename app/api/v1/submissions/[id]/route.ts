import { notFound } from "@/lib/api/errors";
import { apiRoute, readOnly } from "@/lib/api/handler";
import { signedIn } from "@/lib/auth";
import { getOwnSubmission, parseSubmissionId, updateSubmission } from "@/lib/submissions";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";

type Context = { params: Promise<{ id: string }> };

// GET /api/v1/submissions/{id}: one of the caller's own submissions (anyone else's is a 404).
export const GET = apiRoute<Context>(
  async (request, { params }) => {
    const user = await requestUser(request);
    const id = parseSubmissionId((await params).id);
    const submission = await getOwnSubmission(user.id, id);
    if (!submission) throw notFound(`There is no submission with id ${id}.`, "id");
    return privateJson({ submission });
  },
  { guard: signedIn },
);

// PATCH /api/v1/submissions/{id}: the whole submission again plus the `version` it was edited
// from. Owner only (403), only while pending or changes requested (409), and 409 on a stale version.
export const PATCH = apiRoute<Context>(
  async (request, { params }) => {
    const user = await requestUser(request);
    const id = parseSubmissionId((await params).id);
    const submission = await updateSubmission(user, id, await readJsonBody(request));
    return privateJson({ submission });
  },
  { guard: signedIn },
);

const allowed = readOnly(["GET", "PATCH"]);
export const POST = allowed;
export const PUT = allowed;
export const DELETE = allowed;
