// The image formats of evidence photos; lib/storage holds the size limits and the checks.

/** Formats recognised by their magic bytes; the declared Content-Type and the file name are ignored. */
export const ACCEPTED_INPUT_TYPES = ["image/jpeg", "image/png", "image/webp"] as const;
export type AcceptedInputType = (typeof ACCEPTED_INPUT_TYPES)[number];
/** The accepted formats in words, for messages and hints. */
export const ACCEPTED_LABEL = "JPEG, PNG or WebP";

/** What we store after re-encoding: JPEG stays JPEG, PNG and WebP become WebP (keeps transparency). */
export type StoredType = "image/jpeg" | "image/webp";
