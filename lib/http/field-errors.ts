import type { z } from "zod";
import type { FieldErrors } from "./errors";

/**
 * The one mapping from zod issues to the error body's fieldErrors: keyed by the issue's dotted
 * path ("sections.0.scale", or a parameter's name for flat query, path and account schemas), an
 * issue about the whole input under `fallback`, each message listed once per key. Types only from
 * outside, so browser code can use it with the same schemas as the server.
 */
export function fieldErrorsOf(issues: readonly z.core.$ZodIssue[], fallback = "body"): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of issues) {
    const key = issue.path.length ? issue.path.map(String).join(".") : fallback;
    const list = (out[key] ??= []);
    if (!list.includes(issue.message)) list.push(issue.message);
  }
  return out;
}
