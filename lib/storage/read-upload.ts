import { readBodyBytes } from "@/lib/http/body-stream";
import { badRequest, contentTooLarge } from "@/lib/http/errors";
import { MAX_PHOTO_BYTES, formatMegabytes } from "./limits";
import { PHOTO_FIELD } from "./photo-api";

// Reads one uploaded file from a request without ever holding more than the limit in memory:
// lib/http's body reader refuses a body announced as too large before a byte is read, and one
// without a length (chunked) the moment it passes the limit, with 413 naming the `file` field.
// Only then is multipart/form-data parsed, by the platform's own parser (Response.formData),
// from the bounded buffer.

/** Room for the multipart boundaries and part headers around the one file. */
const MULTIPART_OVERHEAD = 64 * 1024;

export type Upload = { bytes: Uint8Array; declaredType: string | null; fileName: string | null };

const tooLarge = () => contentTooLarge(`The photo is larger than ${formatMegabytes(MAX_PHOTO_BYTES)}, the limit.`, PHOTO_FIELD);

/**
 * The one file of an upload: the `file` part of a multipart/form-data body (or its only file
 * part), or else the raw body. The declared type and name are returned for logging only; the
 * bytes decide what the file is (lib/storage/photo-image.ts).
 */
export async function readUpload(request: Request): Promise<Upload> {
  const contentType = request.headers.get("content-type");
  if (contentType?.toLowerCase().startsWith("multipart/form-data")) {
    const raw = await readBodyBytes(request, MAX_PHOTO_BYTES + MULTIPART_OVERHEAD, tooLarge);
    let form: FormData;
    try {
      form = await new Response(raw as BodyInit, { headers: { "content-type": contentType } }).formData();
    } catch {
      throw badRequest({ [PHOTO_FIELD]: ["The form data could not be read. Send one photo as the `file` field."] });
    }
    const files = [...form.values()].filter((v): v is File => typeof v !== "string");
    const named = form.get(PHOTO_FIELD);
    const file = named && typeof named !== "string" ? named : files.length === 1 ? files[0] : undefined;
    if (!file) {
      throw badRequest({
        [PHOTO_FIELD]: [files.length > 1 ? "Send one photo per request, as the `file` field." : "Choose a photo to upload."],
      });
    }
    if (file.size > MAX_PHOTO_BYTES) {
      throw contentTooLarge(`The photo is ${formatMegabytes(file.size)}; the limit is ${formatMegabytes(MAX_PHOTO_BYTES)}.`, PHOTO_FIELD);
    }
    return { bytes: new Uint8Array(await file.arrayBuffer()), declaredType: file.type || null, fileName: file.name || null };
  }
  const bytes = await readBodyBytes(request, MAX_PHOTO_BYTES, tooLarge);
  if (bytes.byteLength === 0) throw badRequest({ [PHOTO_FIELD]: ["The request has no photo in it. Choose a photo to upload."] });
  return { bytes, declaredType: contentType, fileName: null };
}
