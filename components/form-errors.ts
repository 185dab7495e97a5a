import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ApiFetchError, UNREACHABLE_MESSAGE } from "@/lib/client/api-fetch";

// How every form shows a refusal: the server's per-field messages go onto the fields they name
// (react-hook-form's setError, so they sit where the browser-side check would put them), and the
// rest is said once for the whole form.

/** Any thrown value as an ApiFetchError; something that is not one means the answer never came back usable. */
export function asApiFetchError(error: unknown): ApiFetchError {
  return error instanceof ApiFetchError ? error : new ApiFetchError(0, UNREACHABLE_MESSAGE);
}

/** Puts the server's per-field messages onto the form's fields; returns the ones no field shows. */
export function applyFieldErrors<T extends FieldValues>(
  setError: UseFormSetError<T>,
  fieldErrors: Record<string, string[]>,
  fields: readonly string[],
): string[] {
  const rest: string[] = [];
  for (const [field, messages] of Object.entries(fieldErrors)) {
    if (fields.includes(field)) setError(field as Path<T>, { type: "server", message: messages[0] });
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
