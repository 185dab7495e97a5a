import { route, routes } from "@/lib/http";
import { photoUrl, storeEvidencePhoto } from "@/lib/storage/evidence-photos";
import { createdPhotoResponse } from "@/lib/storage/photo-response";
import { readUpload } from "@/lib/storage/read-upload";

// POST /api/v1/photos: one evidence photo, as multipart/form-data (`file`) or as the raw body.
// Answers 201 { id, width, height, byteSize }; the submission form later attaches it by id. The
// sign-in check answers 401 before a byte of the body is read.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "user" }, async ({ req, user }) => {
    const photo = await storeEvidencePhoto(user.id, (await readUpload(req)).bytes);
    return createdPhotoResponse(photo, photoUrl(photo.id));
  }),
});
