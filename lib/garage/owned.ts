import { z } from "zod";
import { ApiError } from "@/lib/http/errors";
import { parseBody } from "@/lib/http/parse-body";
import { pathId } from "@/lib/http/path-id";

// Garage rows are private: another person's row answers exactly as a missing one (404), so ids
// reveal nothing. Bad input becomes the API's field-level 400.

export function notYours(what: string): ApiError {
  return new ApiError(404, `No such ${what} in your garage.`);
}

/** Parses with zod or throws badRequest with one list of messages per field ("cells", "chargedMah"). */
export function parseOrThrow<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  return parseBody(schema, input, "input");
}

/** A path id naming one of the caller's `what`s: a positive int4, or the same 404 as someone else's row. */
export function ownedId(what: string) {
  return pathId(() => `No such ${what} in your garage.`);
}

/** `{ id }` for a route under /garage/<whats>/{id}. */
export function ownedIdParams(what: string) {
  return z.object({ id: ownedId(what) });
}
