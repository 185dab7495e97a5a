import { ApiError, badRequest } from "@/lib/api/errors";
import type { z } from "zod";

// Garage rows are private: another person's row answers exactly as a missing one (404), so ids
// reveal nothing. Bad input becomes the API's field-level 400.

export function notYours(what: string): ApiError {
  return new ApiError(404, `No such ${what} in your garage.`);
}

/** Parses with zod or throws badRequest with one list of messages per field ("cells", "chargedMah"). */
export function parseOrThrow<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  const fields: Record<string, string[]> = {};
  for (const issue of parsed.error.issues) {
    const key = issue.path.length ? issue.path.map(String).join(".") : "input";
    (fields[key] ??= []).push(issue.message);
  }
  throw badRequest(fields);
}

/** A numeric path id, or 404 (a non-number can name no row). */
export function idFrom(raw: string, what: string): number {
  const id = Number(raw);
  if (!Number.isSafeInteger(id) || id <= 0) throw notYours(what);
  return id;
}
