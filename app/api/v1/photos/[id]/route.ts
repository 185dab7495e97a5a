import { apiRoute, readOnly } from "@/lib/api/handler";
import { requireUser, signedIn, userFromRequest } from "@/lib/auth";
import { removeEvidencePhoto } from "@/lib/storage/evidence-photos";
import { photoResponse } from "@/lib/storage/photo-response";

type Context = { params: Promise<{ id: string }> };

// GET /api/v1/photos/{id}: the photo for those allowed to see it (404 for everyone else).
// Anyone may ask; the visibility rule lives in lib/storage/evidence-photos.ts.
export const GET = apiRoute<Context>(async (request, { params }) => {
  const { id } = await params;
  return photoResponse(request, id, await userFromRequest(request));
});

// DELETE /api/v1/photos/{id}: the uploader removes a photo not yet reviewed (soft delete), 204.
export const DELETE = apiRoute<Context>(
  async (request, { params }) => {
    const { id } = await params;
    const user = await requireUser();
    await removeEvidencePhoto(id, user);
    return new Response(null, { status: 204, headers: { "Cache-Control": "no-store" } });
  },
  { guard: signedIn },
);

const allowed = readOnly(["GET", "HEAD", "DELETE"]);
export const POST = allowed;
export const PUT = allowed;
export const PATCH = allowed;
