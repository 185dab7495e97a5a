// How deeply a JSON text nests, found by one pass over its characters before it is parsed. Code
// that walks a parsed body recursively (zod, the idempotency hash in lib/submissions) would
// otherwise run out of stack on a body like [[[[…]]]] 5,000 levels deep, which is a few kB.

/** Deeper than any body this API takes (a submission is about 4 levels); far below any stack limit. */
export const MAX_JSON_DEPTH = 32;

/**
 * Whether `text` opens more than `limit` arrays or objects inside one another. Brackets inside
 * strings do not count (a string ends at an unescaped quote, RFC 8259 §7). It reads no further
 * than the first level past the limit.
 */
export function nestsDeeperThan(text: string, limit: number): boolean {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c /* \ */) i++;
      else if (c === 0x22 /* " */) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b /* [ */ || c === 0x7b /* { */) {
      if (++depth > limit) return true;
    } else if (c === 0x5d /* ] */ || c === 0x7d /* } */) depth--;
  }
  return false;
}
