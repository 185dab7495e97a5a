import { ApiFetchError, apiFetch, errorFromBody } from "@/lib/client/api-fetch";
import { PHOTO_FIELD, PHOTOS_ENDPOINT, type PhotoSummary } from "@/lib/storage/photo-api";

// The evidence photos' two calls. The upload goes over XMLHttpRequest because fetch() cannot report
// upload progress and XHR's upload.onprogress can; its refusal is read by apiFetch's own
// errorFromBody. Both are plain functions rather than react-query hooks: the uploader keeps no
// cache, and it renders on its own, outside any QueryClientProvider (its render test does so).
// The server's field-level message is what the person sees when it refuses.

export type PhotoUpload = { done: Promise<PhotoSummary>; abort: () => void };

const fallbackMessage = (status: number) => `The upload failed (HTTP ${status}). Try again in a moment.`;

/** A refusal said with the photo field's own message when there is one, else the API's (or ours). */
function refusal(error: ApiFetchError): ApiFetchError {
  const field = error.fieldErrors[PHOTO_FIELD]?.[0];
  return field ? new ApiFetchError(error.status, field, error.fieldErrors) : error;
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
      else reject(refusal(errorFromBody(xhr.status, xhr.response, fallbackMessage)));
    };
    xhr.onerror = () => reject(new ApiFetchError(0, "The upload did not reach Shuntbook. Check your connection and try again."));
    xhr.onabort = () => reject(new ApiFetchError(0, "Upload cancelled."));
    const form = new FormData();
    form.append(PHOTO_FIELD, file, file.name);
    xhr.send(form);
  });
  return { done, abort: () => xhr.abort() };
}

/** DELETE /api/v1/photos/{id}; resolves on 204 (or 404: already gone), rejects with the server's message. */
export async function removePhoto(url: string): Promise<void> {
  try {
    await apiFetch<void>(url, { method: "DELETE", fallbackMessage });
  } catch (error) {
    if (!(error instanceof ApiFetchError)) throw error;
    if (error.status === 404) return;
    throw refusal(error);
  }
}
