import type { z } from "zod";
import { badRequest } from "./errors";
import { fieldErrorsOf } from "./field-errors";

/**
 * `input` parsed by `schema`, or a 400 whose fieldErrors come from the one mapping; `fallback`
 * keys an issue about the whole input ("body" for a request body, "input" for the garage's).
 */
export function parseBody<S extends z.ZodType>(schema: S, input: unknown, fallback = "body"): z.output<S> {
  const parsed = schema.safeParse(input);
  if (!parsed.success) throw badRequest(fieldErrorsOf(parsed.error.issues, fallback));
  return parsed.data;
}
