import { ifNoneMatchHits } from "@/lib/http/etag";
import { findViewablePhoto, readPhotoObject, type PhotoSummary, type PhotoViewer } from "./evidence-photos";

// HTTP for evidence photos, so the route handlers stay thin.

/**
 * An approved photo is public evidence and may sit in shared caches for a while; anything else
 * is private to the viewer's browser and revalidated on every use (a 304 is cheap: the tag is the
 * stored object's SHA-256), so a removed or re-reviewed photo does not linger.
 */
export const PUBLIC_PHOTO_CACHE_CONTROL = "public, max-age=600, stale-while-revalidate=3600";
export const PRIVATE_PHOTO_CACHE_CONTROL = "private, no-cache";

// The bytes are ours (re-encoded), but a browser must never treat them as anything but an image.
const PHOTO_SAFETY_HEADERS = {
  "X-Content-Type-Options": "nosniff",
  "Content-Security-Policy": "default-src 'none'; sandbox",
  "Cross-Origin-Resource-Policy": "same-site",
} as const;

/** GET /api/v1/photos/{id}: the stored image streamed through, or 304, or the one 404 body. */
export async function photoResponse(request: Request, id: string, viewer: PhotoViewer): Promise<Response> {
  const photo = await findViewablePhoto(id, viewer);
  const etag = `"${photo.sha256}"`;
  const headers = new Headers({
    ...PHOTO_SAFETY_HEADERS,
    ETag: etag,
    "Cache-Control": photo.isPublic ? PUBLIC_PHOTO_CACHE_CONTROL : PRIVATE_PHOTO_CACHE_CONTROL,
  });
  if (ifNoneMatchHits(request.headers.get("if-none-match"), etag)) return new Response(null, { status: 304, headers });
  headers.set("Content-Type", photo.contentType);
  headers.set("Content-Length", String(photo.byteSize));
  headers.set("Content-Disposition", `inline; filename="evidence-${photo.id}.${photo.contentType === "image/jpeg" ? "jpg" : "webp"}"`);
  const body = request.method === "HEAD" ? null : await readPhotoObject(photo);
  return new Response(body, { status: 200, headers });
}

/** 201 for a stored upload, with where to fetch it. */
export function createdPhotoResponse(photo: PhotoSummary, location: string): Response {
  return new Response(JSON.stringify(photo), {
    status: 201,
    headers: { "Content-Type": "application/json; charset=utf-8", "Cache-Control": "no-store", Location: location },
  });
}
