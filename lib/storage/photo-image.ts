import { createHash } from "node:crypto";
import pLimit from "p-limit";
import sharp, { type Metadata, type OutputInfo } from "sharp";
import { badRequest } from "@/lib/http/errors";
import { PHOTO_FIELD } from "./photo-api";
import { MAX_PHOTO_BYTES, MAX_PHOTO_PIXELS, PHOTO_DECODES_AT_ONCE, formatMegabytes } from "./limits";
import { ACCEPTED_INPUT_TYPES, ACCEPTED_LABEL, type AcceptedInputType, type StoredType } from "@/lib/vocabulary";

// Turns an uploaded file into the bytes we store. Phone photos carry EXIF with GPS position, the
// camera's serial number and the time; evidence is public once approved, so none of it may leave
// with the photo. Re-encoding through sharp (libvips) writes a new file from the pixels alone: it
// drops EXIF, GPS, XMP, IPTC and the ICC profile (converting to sRGB), after turning the pixels
// upright from the EXIF orientation, which would otherwise be lost with the metadata.

export type SanitisedPhoto = {
  data: Buffer;
  contentType: StoredType;
  extension: "jpg" | "webp";
  width: number;
  height: number;
  byteSize: number;
  sha256: string;
};

const LABEL: Record<AcceptedInputType, string> = { "image/jpeg": "JPEG", "image/png": "PNG", "image/webp": "WebP" };

/** At most PHOTO_DECODES_AT_ONCE rasters in memory per process, however many uploads arrive together. */
const decodeSlot = pLimit(PHOTO_DECODES_AT_ONCE);

function refuse(message: string): never {
  throw badRequest({ [PHOTO_FIELD]: [message] });
}

/**
 * The type as the bytes say, never as the client declared it: a script renamed to .jpg or sent
 * as image/jpeg is still refused. file-type is ESM-only, hence the dynamic import.
 */
export async function sniffPhotoType(bytes: Uint8Array): Promise<AcceptedInputType | null> {
  const { fileTypeFromBuffer } = await import("file-type");
  const detected = await fileTypeFromBuffer(bytes);
  return detected && (ACCEPTED_INPUT_TYPES as readonly string[]).includes(detected.mime) ? (detected.mime as AcceptedInputType) : null;
}

export async function sanitisePhoto(bytes: Uint8Array): Promise<SanitisedPhoto> {
  if (bytes.byteLength === 0) refuse("The file is empty. Choose a photo.");
  if (bytes.byteLength > MAX_PHOTO_BYTES) {
    refuse(`The photo is ${formatMegabytes(bytes.byteLength)}; the limit is ${formatMegabytes(MAX_PHOTO_BYTES)}.`);
  }
  const type = await sniffPhotoType(bytes);
  if (!type) refuse(`This file is not a ${ACCEPTED_LABEL} image. Other formats (including HEIC, GIF and PDF) are not accepted; export the photo as JPEG.`);

  // The header's dimensions first, so a decompression bomb is refused with its size named,
  // before any pixel is decoded; limitInputPixels below enforces the same bound inside libvips.
  let header: Metadata;
  try {
    // header only (no pixels are decoded), so no pixel limit here: the check below names the size
    header = await sharp(bytes, { limitInputPixels: false }).metadata();
  } catch {
    refuse(`The ${LABEL[type]} file could not be read; it may be damaged or incomplete.`);
  }
  const pixels = (header.width ?? 0) * (header.height ?? 0);
  if (pixels > MAX_PHOTO_PIXELS) {
    refuse(
      `The photo is ${header.width} × ${header.height} pixels (${(pixels / 1e6).toFixed(0)} megapixels); the limit is ${MAX_PHOTO_PIXELS / 1e6} megapixels.`,
    );
  }

  // libvips refuses more pixels itself too, whatever the header claimed
  const image = sharp(bytes, { limitInputPixels: MAX_PHOTO_PIXELS, failOn: "error", autoOrient: true });
  // JPEG stays JPEG (a photo); PNG and WebP become WebP, which keeps a screenshot's transparency.
  const jpeg = type === "image/jpeg";
  const encoded = jpeg ? image.jpeg({ quality: 85, mozjpeg: true }) : image.webp({ quality: 88 });
  let out: { data: Buffer; info: OutputInfo };
  try {
    out = await decodeSlot(() => encoded.toBuffer({ resolveWithObject: true }));
  } catch {
    refuse(`The ${LABEL[type]} file could not be decoded; it may be damaged or incomplete.`);
  }
  if (out.data.byteLength > MAX_PHOTO_BYTES) {
    refuse(`The photo is still larger than ${formatMegabytes(MAX_PHOTO_BYTES)} after compression; resize it and try again.`);
  }
  return {
    data: out.data,
    contentType: jpeg ? "image/jpeg" : "image/webp",
    extension: jpeg ? "jpg" : "webp",
    width: out.info.width,
    height: out.info.height,
    byteSize: out.data.byteLength,
    sha256: createHash("sha256").update(out.data).digest("hex"),
  };
}
