import { notFound } from "@/lib/api/errors";
import { apiRoute, readOnly } from "@/lib/api/handler";
import { getReview } from "@/lib/moderation";
import { moderatorOnly, privateJson, type IdContext } from "@/lib/moderation/http";
import { parseSubmissionId } from "@/lib/submissions";

// GET /api/v1/moderation/submissions/{id}: the review of one submission (evidence, photos, flags,
// where its values fall, how the published figures would move, the contributor's record, its log).
export const GET = apiRoute<IdContext>(
  async (_request, { params }) => {
    const id = parseSubmissionId((await params).id);
    const review = await getReview(id);
    if (!review) throw notFound(`There is no submission with id ${id}.`, "id");
    return privateJson(review);
  },
  { guard: moderatorOnly },
);

const allowed = readOnly(["GET"]);
export const POST = allowed;
export const PUT = allowed;
export const PATCH = allowed;
export const DELETE = allowed;
