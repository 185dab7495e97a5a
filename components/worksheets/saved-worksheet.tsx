"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState, type FormEvent, type ReactNode } from "react";
import type { z } from "zod";

// What the saved voltage and bench worksheets share on the client: the API calls as react-query
// mutations (each answer replaces the cached worksheet, so the page always shows what the server
// stored), field-level errors from the shared zod schema or the server, and the small pieces of
// the form. The worksheet is refetched when the tab comes back into view, so a reading saved on
// another phone shows up.

export type Errors = Record<string, string[]>;

/** A refused request, with the server's (or the schema's) messages by field; "input" for the whole. */
export class RefusedError extends Error {
  constructor(readonly errors: Errors) {
    super(Object.values(errors).flat().join(" "));
    this.name = "RefusedError";
  }
}

export async function sendJson<T>(url: string, method: "GET" | "POST" | "DELETE", body?: unknown): Promise<T> {
  const init: RequestInit = { method };
  if (body !== undefined) init.headers = { "content-type": "application/json" };
  if (body !== undefined) init.body = JSON.stringify(body);
  const res = await fetch(url, init).catch(() => null);
  const json = res ? await res.json().catch(() => null) : null;
  if (res?.ok) return json as T;
  const error = json?.error ?? { message: "The server did not answer, so nothing was saved. Check the connection and try again.", fieldErrors: {} };
  throw new RefusedError(Object.keys(error.fieldErrors ?? {}).length ? error.fieldErrors : { input: [error.message] });
}

/** Checks form values with the shared schema first: the same words as the server, without the round trip. */
export function checked<S extends z.ZodType>(schema: S, values: unknown): z.output<S> {
  const parsed = schema.safeParse(values);
  if (parsed.success) return parsed.data;
  const errors: Errors = {};
  for (const issue of parsed.error.issues) (errors[issue.path.join(".") || "input"] ??= []).push(issue.message);
  throw new RefusedError(errors);
}

/** A form field's number, undefined when empty (so the schema says "Enter …"). */
export const numberIn = (form: FormData, name: string) => {
  const raw = String(form.get(name) ?? "").trim();
  return raw === "" ? undefined : Number(raw);
};

export const errorsOf = (e: unknown): Errors => (e instanceof RefusedError ? e.errors : e ? { input: [String(e)] } : {});

/**
 * A form's submit handler: read its fields, check them with the shared schema (refusals shown by
 * field, nothing sent), then send. `onRefused` runs on a refusal, e.g. to clear an older server error.
 */
export function useCheckedSubmit<S extends z.ZodType>(schema: S, read: (form: FormData) => unknown, send: (body: z.output<S>) => void, onRefused?: () => void) {
  const [errors, setErrors] = useState<Errors>({});
  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    let body: z.output<S>;
    try {
      body = checked(schema, read(new FormData(event.currentTarget)));
    } catch (e) {
      if (!(e instanceof RefusedError)) throw e;
      onRefused?.();
      setErrors(e.errors);
      return;
    }
    setErrors({});
    send(body);
  }
  return { errors, setErrors, submit };
}

export function useSavedWorksheet<V extends { id: number }>(initial: V) {
  const queryClient = useQueryClient();
  const router = useRouter();
  const base = `/api/v1/garage/worksheets/${initial.id}`;
  const key = ["garage-worksheet", initial.id];
  const query = useQuery({
    queryKey: key,
    queryFn: async () => (await sendJson<{ worksheet: V }>(base, "GET")).worksheet,
    initialData: initial,
    refetchOnWindowFocus: true,
  });
  const store = ({ worksheet }: { worksheet: V }) => queryClient.setQueryData(key, worksheet);
  const add = useMutation({ mutationFn: (body: unknown) => sendJson<{ worksheet: V }>(`${base}/steps`, "POST", body), onSuccess: store });
  const remove = useMutation({ mutationFn: (position: number) => sendJson<{ worksheet: V }>(`${base}/steps/${position}`, "DELETE"), onSuccess: store });
  const publish = useMutation({
    mutationFn: () => sendJson<{ submission: { id: number } }>(`${base}/publish`, "POST", {}),
    onSuccess: ({ submission }) => router.push(`/my/submissions?sent=${submission.id}`),
  });
  return {
    sheet: query.data ?? initial,
    add,
    remove,
    publish,
    addErrors: errorsOf(add.error),
    removeErrors: errorsOf(remove.error),
    publishErrors: errorsOf(publish.error),
    busy: add.isPending || remove.isPending || publish.isPending,
  };
}

/** Starts a worksheet of a kind on a quad; the answer is the new worksheet. */
export function useStartWorksheet<V>(onStarted: (sheet: V) => void) {
  return useMutation({
    mutationFn: (body: unknown) => sendJson<{ worksheet: V }>("/api/v1/garage/worksheets", "POST", body),
    onSuccess: ({ worksheet }) => onStarted(worksheet),
  });
}

export function FieldError({ id, messages }: { id?: string; messages?: string[] }) {
  if (!messages?.length) return null;
  return (
    <p id={id} className="mt-1 font-semibold text-fault">
      <span aria-hidden="true">⚠ </span>
      {messages.join(" ")}
    </p>
  );
}

export function NumberInput(props: { idPrefix: string; name: string; label: string; errors: Errors; hint?: string; defaultValue?: number | string }) {
  const id = `${props.idPrefix}-${props.name}`;
  const messages = props.errors[props.name];
  return (
    <div className="min-w-0">
      <label htmlFor={id} className="mb-1 block font-semibold">{props.label}</label>
      <input id={id} name={props.name} type="number" inputMode="decimal" step="any" className="sb-field" defaultValue={props.defaultValue}
        aria-invalid={messages ? true : undefined} aria-describedby={messages ? `${id}-error` : undefined} />
      {props.hint && <p className="mt-1 text-small text-muted">{props.hint}</p>}
      <FieldError id={`${id}-error`} messages={messages} />
    </div>
  );
}

export function Warnings({ items }: { items: Array<{ field: string; message: string }> }) {
  if (!items.length) return null;
  return (
    <ul className="space-y-1 rounded-md border-2 border-caution-edge bg-caution p-3 text-small" data-testid="worksheet-warnings">
      {items.map((w) => <li key={w.field + w.message}>⚠ {w.message}</li>)}
    </ul>
  );
}

/** Publish when finished; once published, which submission it became. */
export function PublishPanel(props: { submissionId: number | null; ready: boolean; busy: boolean; errors: Errors; onPublish: () => void; what: ReactNode }) {
  if (props.submissionId != null) return <p className="font-semibold" data-testid="published">Published as submission #{props.submissionId}: pending review.</p>;
  if (!props.ready) return null;
  const messages = Object.values(props.errors).flat();
  return (
    <div className="space-y-2">
      <FieldError messages={messages} />
      <button type="button" className="sb-button w-full sm:w-auto" onClick={props.onPublish} disabled={props.busy} data-testid="publish">Publish to Shuntbook</button>
      <p className="text-small text-muted">{props.what} A moderator reviews it like any other contribution.</p>
    </div>
  );
}

/**
 * The saved readings or points of a worksheet, numbered, with "take back" on the last while the
 * worksheet is open, and the taken-back ones kept below, struck out and not counted.
 */
export function SavedEntries<E extends { position: number }, R extends { removedAt: string }>(props: {
  id: string;
  title: string;
  testId: string;
  entries: readonly E[];
  removed: readonly R[];
  describe: (entry: E | R) => ReactNode;
  open: boolean;
  busy: boolean;
  onRemove: (position: number) => void;
  removeErrors: Errors;
}) {
  const last = props.entries.at(-1);
  return (
    <>
      {props.entries.length > 0 && (
        <section aria-labelledby={props.id} className="space-y-2">
          <h2 id={props.id} className="font-display text-lg font-bold tracking-wide uppercase">{props.title}</h2>
          <ol className="space-y-2" data-testid={props.testId}>
            {props.entries.map((entry) => (
              <li key={entry.position} className="flex flex-wrap items-center justify-between gap-2 rounded-md border-2 border-rule bg-surface p-3">
                <span>
                  <span className="font-semibold">{entry.position + 1}.</span> {props.describe(entry)}
                </span>
                {props.open && entry === last && (
                  <button type="button" className="sb-button sb-button-quiet" disabled={props.busy} onClick={() => props.onRemove(entry.position)}>Take back</button>
                )}
              </li>
            ))}
          </ol>
          <FieldError messages={Object.values(props.removeErrors).flat()} />
        </section>
      )}
      <TakenBack removed={props.removed} describe={props.describe} />
    </>
  );
}

/** The entries a builder took back: kept, struck out, not counted. Nothing when there are none. */
export function TakenBack<R extends { removedAt: string }>({ removed, describe }: { removed: readonly R[]; describe: (entry: R) => ReactNode }) {
  if (removed.length === 0) return null;
  return (
    <details className="text-small">
      <summary className="text-muted">{removed.length} taken back (kept here, not counted)</summary>
      <ul className="mt-1 space-y-1">
        {removed.map((entry) => <li key={entry.removedAt}><del>{describe(entry)}</del></li>)}
      </ul>
    </details>
  );
}
