import { z } from "zod";

// Row ids in paths are PostgreSQL integer (int4) keys. Anything else cannot name a row, so it is
// a 404 like a missing row, not a 400: route() turns a params issue into a 404 naming the param.

const INT4_MAX = 2_147_483_647;

function isRowId(raw: string): boolean {
  return /^[1-9][0-9]{0,9}$/.test(raw) && Number(raw) <= INT4_MAX;
}

/** A positive int4 id from the path; `missing(raw)` is the 404's message otherwise. */
export function pathId(missing: (raw: string) => string) {
  return z
    .string()
    .refine(isRowId, { error: (issue) => missing(String(issue.input)) })
    .transform(Number);
}

/** `{ id }` for a route under /<things>/{id}, with the 404 message "There is no <what> with id <raw>." */
export function idParams(what: string) {
  return z.object({ id: pathId((raw) => `There is no ${what} with id ${raw}.`) });
}
