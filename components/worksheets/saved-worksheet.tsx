"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import type { ReactNode } from "react";
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

const errorsOf = (e: unknown): Errors => (e instanceof RefusedError ? e.errors : e ? { input: [String(e)] } : {});

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
