import { idParams, notFound, privateJson, route, routes } from "@/lib/http";
import { getReview } from "@/lib/moderation";

// GET /api/v1/moderation/submissions/{id}: the review of one submission (evidence, photos, flags,
// where its values fall, how the published figures would move, the contributor's record, its log).
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "moderator", params: idParams("submission") }, async ({ params: { id } }) => {
    const review = await getReview(id);
    if (!review) throw notFound(`There is no submission with id ${id}.`, "id");
    return privateJson(review);
  }),
});
