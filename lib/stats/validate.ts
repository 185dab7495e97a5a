// Input checks shared by every entry point of lib/stats. A bad input is a programming or data
// error upstream, so it throws with the offending field named rather than yielding NaN later.

/**
 * Largest magnitude accepted for one value. Far beyond any calibration setting (the submissions
 * table caps values below 1e6), and small enough that every difference, sum and product the
 * library forms stays finite, so no output can become Infinity or NaN.
 */
export const MAX_ABS_VALUE = 1e12;

/** A bad argument, with the field that was wrong (e.g. "values[3]", "step"). */
export class StatsInputError extends Error {
  readonly field: string;
  constructor(field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = "StatsInputError";
    this.field = field;
  }
}

/** Throws unless `value` is a finite number within ±MAX_ABS_VALUE. */
export function checkFiniteNumber(value: unknown, field: string): number {
  if (typeof value !== "number" || Number.isNaN(value)) {
    throw new StatsInputError(field, "must be a number");
  }
  if (!Number.isFinite(value)) throw new StatsInputError(field, "must be finite");
  if (Math.abs(value) > MAX_ABS_VALUE) {
    throw new StatsInputError(field, `must be between -${MAX_ABS_VALUE} and ${MAX_ABS_VALUE}`);
  }
  return value;
}

/** Checks every entry and returns an ascending copy; the caller's array is left untouched. */
export function sortedCopy(values: unknown, field = "values"): Float64Array {
  if (!Array.isArray(values)) throw new StatsInputError(field, "must be an array of numbers");
  const out = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) out[i] = checkFiniteNumber(values[i], `${field}[${i}]`);
  // A typed-array sort is numeric (not the string order of Array.prototype.sort) and fast at n = 1e6.
  return out.sort();
}
