import { apiRoute, readOnly } from "@/lib/api/handler";
import { requireUser, signedIn } from "@/lib/auth";
import { photoUrl, storeEvidencePhoto } from "@/lib/storage/evidence-photos";
import { createdPhotoResponse } from "@/lib/storage/photo-response";
import { readUpload } from "@/lib/storage/read-upload";

// POST /api/v1/photos: one evidence photo, as multipart/form-data (`file`) or as the raw body.
// Answers 201 { id, width, height, byteSize }; the submission form later attaches it by id. The
// guard answers 401 before a byte of the body is read.
export const POST = apiRoute(
  async (request) => {
    const user = await requireUser();
    const upload = await readUpload(request);
    const photo = await storeEvidencePhoto(user.id, upload.bytes);
    return createdPhotoResponse(photo, photoUrl(photo.id));
  },
  { guard: signedIn },
);

const postOnly = readOnly(["POST"]);
export const GET = postOnly;
export const PUT = postOnly;
export const PATCH = postOnly;
export const DELETE = postOnly;
