"use client";

import { useEffect, useId, useRef, useState, useSyncExternalStore } from "react";
import { MAX_PHOTO_BYTES, MAX_PHOTOS_PER_SUBMISSION, formatFileSize, formatMegabytes } from "@/lib/storage/limits";
import { ACCEPTED_INPUT_TYPES, ACCEPTED_LABEL } from "@/lib/vocabulary";
import { photoUrl, type PhotoSummary } from "@/lib/storage/photo-api";
import { removePhoto, sendPhoto } from "./send-photo";

// Evidence photos for one submission draft: pick files, watch each upload's progress, see a
// thumbnail once stored, remove one again. The parent form gets the stored ids through onChange
// and passes them to attachPhotosToSubmission when it creates the submission. The server is the
// judge of every file (type by magic bytes, size, pixels); the checks here only spare a pointless
// upload of something that is certain to be refused.
//
// draftKey names the draft: the stored photos are remembered in sessionStorage under it, so a
// reload of the form (or a trip back from the preview) does not lose them.

type Stored = { key: string; name: string; photo: PhotoSummary };
type Uploading = { key: string; name: string; percent: number };
type Refused = { key: string; name: string; message: string };

const STORAGE_PREFIX = "shuntbook:evidence-photos:";

function precheck(file: File): string | null {
  if (file.size > MAX_PHOTO_BYTES) {
    return `${file.name} is ${formatMegabytes(file.size)}; the limit is ${formatMegabytes(MAX_PHOTO_BYTES)} per photo.`;
  }
  // an empty type means the browser does not know: let the server look at the bytes
  if (file.type && !(ACCEPTED_INPUT_TYPES as readonly string[]).includes(file.type)) {
    return `${file.name} is not a ${ACCEPTED_LABEL} image. Export it as JPEG and try again.`;
  }
  if (file.size === 0) return `${file.name} is empty.`;
  return null;
}

function readDraft(draftKey: string): Stored[] {
  try {
    const raw = window.sessionStorage.getItem(STORAGE_PREFIX + draftKey);
    const parsed: unknown = raw ? JSON.parse(raw) : [];
    return Array.isArray(parsed) ? (parsed as Stored[]).filter((s) => typeof s?.photo?.id === "string") : [];
  } catch {
    return []; // storage disabled or corrupt: start empty
  }
}

// true in the browser once hydrated, false on the server and while hydrating, so what is rendered
// from sessionStorage never disagrees with the server's HTML
const subscribeToNothing = () => () => {};
const useHydrated = () =>
  useSyncExternalStore(
    subscribeToNothing,
    () => true,
    () => false,
  );

function writeDraft(draftKey: string, stored: Stored[]): void {
  try {
    window.sessionStorage.setItem(STORAGE_PREFIX + draftKey, JSON.stringify(stored));
  } catch {
    // private mode or full: the photos are still on the server and in this page's state
  }
}

export function EvidencePhotos({ draftKey, onChange }: { draftKey: string; onChange: (photoIds: string[]) => void }) {
  const id = useId();
  const inputId = `${id}-input`;
  const hintId = `${id}-hint`;
  const errorsId = `${id}-errors`;
  const [stored, setStored] = useState<Stored[]>([]);
  const [uploading, setUploading] = useState<Uploading[]>([]);
  const [refused, setRefused] = useState<Refused[]>([]);
  // the draftKey whose photos `stored` holds; null until the draft has been read
  const [restoredFor, setRestoredFor] = useState<string | null>(null);
  const aborts = useRef(new Map<string, () => void>());
  const nextKey = useRef(0);
  // the latest onChange without making it an effect dependency (parents pass a new one each render)
  const onChangeRef = useRef(onChange);
  useEffect(() => {
    onChangeRef.current = onChange;
  }, [onChange]);

  // sessionStorage exists only in the browser, so the draft is read once hydrated (state adjusted
  // during render, the way React documents for state that follows a prop, here draftKey)
  const hydrated = useHydrated();
  if (hydrated && restoredFor !== draftKey) {
    setRestoredFor(draftKey);
    setStored(readDraft(draftKey));
  }
  const restored = restoredFor === draftKey;

  // every setStored below adds or removes a photo, so a new `stored` is news to the parent
  useEffect(() => {
    if (!restored) return;
    writeDraft(draftKey, stored);
    onChangeRef.current(stored.map((s) => s.photo.id));
  }, [stored, restored, draftKey]);

  // leaving the page cancels uploads still under way
  useEffect(() => () => aborts.current.forEach((abort) => abort()), []);

  const room = MAX_PHOTOS_PER_SUBMISSION - stored.length - uploading.length;

  function start(file: File) {
    const key = `u${nextKey.current++}`;
    setUploading((list) => [...list, { key, name: file.name, percent: 0 }]);
    const upload = sendPhoto(file, (percent) => setUploading((list) => list.map((u) => (u.key === key ? { ...u, percent } : u))));
    aborts.current.set(key, upload.abort);
    upload.done
      .then((photo) => setStored((list) => [...list, { key, name: file.name, photo }]))
      .catch((error: Error) => setRefused((list) => [...list, { key, name: file.name, message: error.message }]))
      .finally(() => {
        aborts.current.delete(key);
        setUploading((list) => list.filter((u) => u.key !== key));
      });
  }

  function choose(files: FileList | null) {
    if (!files) return;
    const problems: Refused[] = [];
    let free = room;
    for (const file of Array.from(files)) {
      const problem = free <= 0 ? `${file.name} was not added: a submission can have ${MAX_PHOTOS_PER_SUBMISSION} photos.` : precheck(file);
      if (problem) problems.push({ key: `r${nextKey.current++}`, name: file.name, message: problem });
      else {
        free -= 1;
        start(file);
      }
    }
    setRefused(problems);
  }

  async function remove(item: Stored) {
    try {
      await removePhoto(photoUrl(item.photo.id));
      setStored((list) => list.filter((s) => s.key !== item.key));
    } catch (error) {
      setRefused([{ key: `r${nextKey.current++}`, name: item.name, message: (error as Error).message }]);
    }
  }

  return (
    <fieldset className="rounded-md border-3 border-rule bg-surface p-4">
      <legend className="px-1 font-display text-heading uppercase">Evidence photos</legend>
      <label htmlFor={inputId} className="mb-1 block font-semibold">
        Add photos <span className="font-normal text-muted">(optional, up to {MAX_PHOTOS_PER_SUBMISSION})</span>
      </label>
      <p id={hintId} className="mb-2 text-small text-muted">
        {ACCEPTED_LABEL}, up to {formatMegabytes(MAX_PHOTO_BYTES)} each: the meter beside the OSD, the charger&rsquo;s mAh readout. Location and camera details
        are removed before a photo is stored. Moderators see your photos; everyone sees them once the submission is approved.
      </p>
      <input
        id={inputId}
        type="file"
        accept={ACCEPTED_INPUT_TYPES.join(",")}
        multiple
        disabled={room <= 0}
        aria-describedby={`${hintId} ${errorsId}`}
        aria-invalid={refused.length > 0 || undefined}
        onChange={(event) => {
          choose(event.currentTarget.files);
          event.currentTarget.value = ""; // the same file may be picked again after a refusal
        }}
        className="sb-field cursor-pointer file:mr-3 file:cursor-pointer file:rounded file:border-2 file:border-copper file:bg-copper file:px-3 file:py-1.5 file:font-bold file:text-on-copper disabled:cursor-not-allowed disabled:opacity-60"
      />

      <div id={errorsId} aria-live="assertive">
        {refused.length > 0 && (
          <ul className="mt-3 space-y-2 rounded-md border-3 border-fault bg-fault-wash p-3">
            {refused.map((r) => (
              <li key={r.key} className="font-semibold text-fault">
                {r.message.includes(r.name) ? r.message : `${r.name}: ${r.message}`}
              </li>
            ))}
          </ul>
        )}
      </div>

      {uploading.length > 0 && (
        <ul className="mt-3 space-y-3" aria-label="Uploads in progress">
          {uploading.map((u) => (
            <li key={u.key} className="rounded-md border-2 border-rule-soft p-3">
              <div className="flex items-center justify-between gap-3">
                <span id={`${id}-${u.key}`} className="min-w-0 truncate font-semibold">
                  {u.name}
                </span>
                <span className="font-mono" aria-hidden="true">
                  {u.percent}&nbsp;%
                </span>
              </div>
              <progress
                max={100}
                value={u.percent}
                aria-labelledby={`${id}-${u.key}`}
                aria-valuetext={`${u.percent} percent uploaded`}
                className="mt-2 block h-3 w-full overflow-hidden rounded-sm border-2 border-rule [&::-moz-progress-bar]:bg-copper [&::-webkit-progress-bar]:bg-sunken [&::-webkit-progress-value]:bg-copper"
              >
                {u.percent} %
              </progress>
              <button type="button" className="sb-button sb-button-quiet mt-2" onClick={() => aborts.current.get(u.key)?.()}>
                Cancel<span className="sr-only"> upload of {u.name}</span>
              </button>
            </li>
          ))}
        </ul>
      )}

      {stored.length > 0 && (
        <ul className="mt-4 grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4" aria-label="Photos added">
          {stored.map((s, index) => (
            <li key={s.key} className="flex flex-col rounded-md border-2 border-rule-soft bg-sunken p-2">
              {/* a plain img: our own API streams the photo with its access check; an optimiser in between would cache it publicly */}
              {/* eslint-disable-next-line @next/next/no-img-element */}
              <img
                src={photoUrl(s.photo.id)}
                alt={`Evidence photo ${index + 1}: ${s.name}`}
                width={s.photo.width}
                height={s.photo.height}
                loading="lazy"
                className="aspect-square w-full rounded-sm object-cover"
              />
              <span className="mt-1 truncate text-small" title={s.name}>
                {s.name}
              </span>
              <span className="font-mono text-small text-muted">
                {s.photo.width}&thinsp;×&thinsp;{s.photo.height}, {formatFileSize(s.photo.byteSize)}
              </span>
              <button type="button" className="sb-button sb-button-quiet mt-2 w-full" onClick={() => remove(s)}>
                Remove<span className="sr-only"> photo {index + 1}</span>
              </button>
            </li>
          ))}
        </ul>
      )}
      <p className="mt-3 text-small text-muted" aria-live="polite">
        {stored.length} of {MAX_PHOTOS_PER_SUBMISSION} photos added
        {uploading.length > 0 ? `, ${uploading.length} uploading` : ""}.
      </p>
    </fieldset>
  );
}
