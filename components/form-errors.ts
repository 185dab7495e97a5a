import type { FieldErrors, FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ApiFetchError, UNREACHABLE_MESSAGE } from "@/lib/client/api-fetch";

// The one place where a form's messages are placed: the server's per-field messages go onto the
// fields they name (react-hook-form's setError, so they sit where the browser-side check would put
// them), and the rest is said once for the whole form.

/** Messages by field path ("readings.0.cells"); a message about the whole form is under "input". */
export type Errors = Record<string, string[]>;

type ErrorNode = { message?: unknown; types?: Record<string, unknown> };

function messagesOf(node: ErrorNode): string[] {
  const all = node.types ? Object.values(node.types).flat() : [node.message];
  return all.filter((m): m is string => typeof m === "string" && m !== "");
}

/** react-hook-form's nested errors as flat paths, every message of each (the form keeps them all). */
export function flatErrors(errors: FieldErrors, prefix = ""): Errors {
  const out: Errors = {};
  for (const [key, value] of Object.entries(errors ?? {})) {
    if (!value || typeof value !== "object" || key === "ref" || key === "types") continue;
    if (key === "root" && prefix === "") {
      for (const node of Object.values(value as Record<string, ErrorNode>)) if (node && typeof node === "object") (out.input ??= []).push(...messagesOf(node));
      const own = messagesOf(value as ErrorNode);
      if (own.length) (out.input ??= []).push(...own);
      continue;
    }
    const path = prefix ? `${prefix}.${key}` : key;
    const messages = messagesOf(value as ErrorNode);
    if (messages.length) out[path] = messages;
    Object.assign(out, flatErrors(value as FieldErrors, path));
  }
  return out;
}

/** Any thrown value as an ApiFetchError; something that is not one means the answer never came back usable. */
export function asApiFetchError(error: unknown): ApiFetchError {
  return error instanceof ApiFetchError ? error : new ApiFetchError(0, UNREACHABLE_MESSAGE);
}

/** A refused request's messages: by field when the server named fields, else under "input". */
export function errorsOf(error: unknown): Errors {
  if (!error) return {};
  if (!(error instanceof ApiFetchError)) return { input: [String(error)] };
  const fields = Object.entries(error.fieldErrors).filter(([, messages]) => messages.length > 0);
  return fields.length ? Object.fromEntries(fields) : { input: [error.message] };
}

/**
 * Puts the server's per-field messages onto those of `fields` the form has; returns the messages no
 * field shows. A field shows its first message unless `say` says otherwise (the worksheet and garage
 * forms show them all, the account forms one at a time).
 */
export function applyFieldErrors<T extends FieldValues>(
  setError: UseFormSetError<T>,
  fieldErrors: Errors,
  fields: readonly string[],
  say: (messages: string[]) => string = (messages) => messages[0],
): string[] {
  const rest: string[] = [];
  for (const [field, messages] of Object.entries(fieldErrors)) {
    if (fields.includes(field)) setError(field as Path<T>, { type: "server", message: say(messages) });
    else rest.push(...messages);
  }
  return rest;
}

/**
 * The message for the whole form after a refusal, or null when the fields already say it all:
 * said when some field error has no field here, or when there were no field errors at all.
 */
export function formProblem<T extends FieldValues>(setError: UseFormSetError<T>, error: unknown, fields: readonly string[]): string | null {
  const e = asApiFetchError(error);
  const rest = applyFieldErrors(setError, e.fieldErrors, fields);
  return rest.length || !Object.keys(e.fieldErrors).length ? e.message : null;
}

/** Puts a refused request's messages on the form's fields, every path the server names; the rest on the form's root. */
export function showServerErrors<V extends FieldValues>(setError: UseFormSetError<V>, error: unknown): void {
  const { input, ...fields } = errorsOf(error);
  const joined = (messages: string[]) => messages.join(" ");
  applyFieldErrors(setError, fields, Object.keys(fields), joined);
  if (input) setError("root.server", { type: "server", message: joined(input) });
}
