import { z } from "zod";
import { badRequest, type FieldErrors } from "./errors";
import { fieldErrorsOf } from "./field-errors";

/**
 * The query string as parseCatalogueParams takes it: one string per parameter, or an array when
 * the parameter was repeated (so the parser can name the repeat instead of silently taking one).
 */
export function queryRecord(request: Request): Record<string, string | string[]> {
  const search = new URL(request.url).searchParams;
  const out: Record<string, string | string[]> = {};
  for (const key of new Set(search.keys())) {
    const all = search.getAll(key);
    out[key] = all.length === 1 ? all[0] : all;
  }
  return out;
}

export type QueryResult<T> = { ok: true; params: T } | { ok: false; fieldErrors: FieldErrors };

/**
 * Parses a query record through an object schema with the catalogue's conventions
 * (lib/catalogue/search-params.ts): an empty value counts as absent, a parameter given twice with
 * values is an error naming it, and unknown parameters are ignored so that tracking tags do not
 * break links. For endpoints whose parameters are not the catalogue's.
 */
export function parseQuery<S extends z.ZodObject>(schema: S, input: Record<string, string | string[] | undefined>): QueryResult<z.output<S>> {
  const fieldErrors: FieldErrors = {};
  const raw: Record<string, string> = {};
  for (const field of Object.keys(schema.shape)) {
    const value = input[field];
    const filled = (Array.isArray(value) ? value : value === undefined ? [] : [value]).filter((v) => v.trim() !== "");
    if (filled.length > 1) fieldErrors[field] = [`${field} was given ${filled.length} times; give it once`];
    else if (filled.length === 1) raw[field] = filled[0];
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    for (const [field, messages] of Object.entries(fieldErrorsOf(parsed.error.issues, "query"))) (fieldErrors[field] ??= []).push(...messages);
  }
  if (!parsed.success || Object.keys(fieldErrors).length > 0) return { ok: false, fieldErrors };
  return { ok: true, params: parsed.data };
}

/** parseQuery for a handler: the parameters, or a 400 naming each refused one. */
export function parseQueryOrRefuse<S extends z.ZodObject>(schema: S, input: Record<string, string | string[] | undefined>): z.output<S> {
  const parsed = parseQuery(schema, input);
  if (!parsed.ok) throw badRequest(parsed.fieldErrors);
  return parsed.params;
}

/** A whole-number query parameter from `min` to `max`: every refusal says `message`, except a too-large value, which says `tooLarge`. */
export function wholeNumberParam(message: string, min: number, max: number, tooLarge = message) {
  return z.coerce.number({ error: message }).int(message).min(min, message).max(max, tooLarge);
}

/** `page`, from 1 (default) to `max`: a page past that is refused rather than scanned. */
export const pageParam = (max = 10_000) => wholeNumberParam("page is a whole number from 1", 1, max, `page is at most ${max}`).default(1);

/** `pageSize`, from 1 to `max`. */
export const pageSizeParam = (max: number, byDefault: number) => wholeNumberParam(`pageSize is a whole number from 1 to ${max}`, 1, max).default(byDefault);
