// The photo API's addresses, field names and answer shape: plain values with no server imports,
// so the upload component (a client component) and the server code share them.

export const PHOTOS_ENDPOINT = "/api/v1/photos";

/** The multipart field the upload sends its one file in; every refusal of a file names it. */
export const PHOTO_FIELD = "file";

/** The field the submission form sends its photo ids in; attach errors name it. */
export const PHOTO_IDS_FIELD = "photoIds";

/** What POST /api/v1/photos answers, and what a submission's photo list holds. */
export type PhotoSummary = { id: string; width: number; height: number; byteSize: number };

export function photoUrl(id: string): string {
  return `${PHOTOS_ENDPOINT}/${encodeURIComponent(id)}`;
}
