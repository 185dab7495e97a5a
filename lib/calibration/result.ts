import type { z } from "zod";

// What every worksheet returns. A worksheet is filled in field by field, so a bad input is
// answered with every problem at once, each naming its field by the same dotted path the
// submission schema uses ("cycles.2.chargedMah"), and never with NaN further down.

/** One problem with one input, or one caution about it. `field` is a dotted path into the input. */
export type FieldIssue = { field: string; message: string };

export type WorksheetResult<T> = { ok: true; value: T; warnings: FieldIssue[] } | { ok: false; errors: FieldIssue[]; warnings: FieldIssue[] };

/** Thrown by unwrapWorksheet and by the small hardware helpers, carrying the field-level errors. */
export class WorksheetInputError extends RangeError {
  constructor(readonly errors: FieldIssue[]) {
    super(errors.map((e) => `${e.field}: ${e.message}`).join("; "));
    this.name = "WorksheetInputError";
  }
}

export const ok = <T>(value: T, warnings: FieldIssue[] = []): WorksheetResult<T> => ({ ok: true, value, warnings });
export const failed = <T>(errors: FieldIssue[], warnings: FieldIssue[] = []): WorksheetResult<T> => ({ ok: false, errors, warnings });

/** The value of a result, or a WorksheetInputError with its errors: for callers that prefer exceptions. */
export function unwrapWorksheet<T>(result: WorksheetResult<T>): T {
  if (!result.ok) throw new WorksheetInputError(result.errors);
  return result.value;
}

/** zod's issues as field issues; an issue about the whole input is filed under "input". */
function issuesFromZod(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({ field: issue.path.length ? issue.path.map(String).join(".") : "input", message: issue.message }));
}

/** Parses with a zod schema; the parsed data or the field issues. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown): { data: z.output<S> } | { errors: FieldIssue[] } {
  const parsed = schema.safeParse(input);
  return parsed.success ? { data: parsed.data } : { errors: issuesFromZod(parsed.error) };
}
