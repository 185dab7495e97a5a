import { PHOTO_FIELD, PHOTOS_ENDPOINT, type PhotoSummary } from "@/lib/storage/photo-api";

// One photo upload over XMLHttpRequest: fetch() cannot report upload progress, XHR's
// upload.onprogress can. The server's field-level message is what the person sees when it refuses.

export type PhotoUpload = { done: Promise<PhotoSummary>; abort: () => void };

export class UploadRefused extends Error {
  constructor(message: string, readonly status: number) {
    super(message);
    this.name = "UploadRefused";
  }
}

type ErrorBody = { error?: { message?: string; fieldErrors?: Record<string, string[]> } };

function refusalMessage(body: unknown, status: number): string {
  const error = (body as ErrorBody | null)?.error;
  const field = error?.fieldErrors?.[PHOTO_FIELD]?.[0];
  if (field) return field;
  if (error?.message) return error.message;
  return `The upload failed (HTTP ${status}). Try again in a moment.`;
}

export function sendPhoto(file: File, onProgress: (percent: number) => void): PhotoUpload {
  const xhr = new XMLHttpRequest();
  const done = new Promise<PhotoSummary>((resolve, reject) => {
    xhr.open("POST", PHOTOS_ENDPOINT);
    xhr.responseType = "json";
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(Math.min(100, Math.round((event.loaded / event.total) * 100)));
    };
    xhr.onload = () => {
      if (xhr.status === 201) resolve(xhr.response as PhotoSummary);
      else reject(new UploadRefused(refusalMessage(xhr.response, xhr.status), xhr.status));
    };
    xhr.onerror = () => reject(new UploadRefused("The upload did not reach Shuntbook. Check your connection and try again.", 0));
    xhr.onabort = () => reject(new UploadRefused("Upload cancelled.", 0));
    const form = new FormData();
    form.append(PHOTO_FIELD, file, file.name);
    xhr.send(form);
  });
  return { done, abort: () => xhr.abort() };
}

/** DELETE /api/v1/photos/{id}; resolves on 204 (or 404: already gone), rejects with the server's message. */
export async function removePhoto(url: string): Promise<void> {
  const res = await fetch(url, { method: "DELETE" });
  if (res.status === 204 || res.status === 404) return;
  throw new UploadRefused(refusalMessage(await res.json().catch(() => null), res.status), res.status);
}
