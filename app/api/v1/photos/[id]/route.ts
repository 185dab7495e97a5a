import { z } from "zod";
import { noContent, route, routes } from "@/lib/http";
import { removeEvidencePhoto } from "@/lib/storage/evidence-photos";
import { photoResponse } from "@/lib/storage/photo-response";

const PhotoParams = z.object({ id: z.string() });

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  // GET /api/v1/photos/{id}: the photo for those allowed to see it (404 for everyone else).
  // Anyone may ask; the visibility rule lives in lib/storage/evidence-photos.ts.
  GET: route({ auth: "optional", params: PhotoParams }, async ({ req, user, params }) => photoResponse(req, params.id, user)),
  // DELETE /api/v1/photos/{id}: the uploader removes a photo not yet reviewed (soft delete), 204.
  DELETE: route({ auth: "user", params: PhotoParams }, async ({ user, params }) => {
    await removeEvidencePhoto(params.id, user);
    return noContent();
  }),
});
