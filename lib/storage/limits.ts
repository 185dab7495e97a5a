// How large an evidence photo may be. One file so the route, the lib, the migration's CHECKs (which
// repeat these numbers in SQL) and the upload component agree; the formats are in lib/vocabulary.

/** 8 MiB: a phone's full-resolution JPEG fits; a video or a RAW file does not. */
export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;

/**
 * 24 megapixels decoded: a camera's 6000 × 4000 frame and twice a phone's usual 12 MP photo
 * (4032 × 3024; common practice, no source), enough to read a meter or a pad. It bounds what a
 * decoder may claim (about 96 MB as RGBA), so a small file that decompresses to a huge raster is
 * refused from its header: a 38 kB PNG of 6300 × 6300 (39.7 MP) once took 4.4 s and 189 MB.
 */
export const MAX_PHOTO_PIXELS = 24_000_000;

/** Photos decoded at once per server process; more wait their turn, so memory stays a few rasters. */
export const PHOTO_DECODES_AT_ONCE = 2;

/** Photos on one submission; enough for a meter, the board, the OSD and a charger screen or two. */
export const MAX_PHOTOS_PER_SUBMISSION = 8;

/** Photos one person may hold that are not yet part of a submission, so the store cannot be filled. */
export const MAX_UNATTACHED_PHOTOS_PER_USER = 30;

/** "8 MB" for people; the limit is binary megabytes, as phones and file managers count them. */
export function formatMegabytes(bytes: number): string {
  const mb = bytes / (1024 * 1024);
  return `${mb >= 10 || Number.isInteger(mb) ? Math.round(mb) : mb.toFixed(1)} MB`;
}

/** A stored photo's size for people: KB below a megabyte, else as formatMegabytes. */
export function formatFileSize(bytes: number): string {
  return bytes < 1024 * 1024 ? `${Math.max(1, Math.round(bytes / 1024))} KB` : formatMegabytes(bytes);
}
