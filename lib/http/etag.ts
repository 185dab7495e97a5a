import { createHash } from "node:crypto";

// Entity tags for the API's responses (RFC 9110 §8.8.3). They are strong tags: equal tag, equal
// bytes. Two ways to make one:
//  - etagOf(body): a hash of the serialised body, for responses that are cheap to rebuild;
//  - etagOf(stamp, variant): a hash of a freshness stamp that is already at hand (see
//    lib/published/api-response.ts), so a matching If-None-Match is answered 304 without
//    building the body at all.

/** A quoted, strong entity tag: the first 128 bits of SHA-1 over the parts, base64url. */
export function etagOf(...parts: string[]): string {
  const hash = createHash("sha1");
  for (const part of parts) hash.update(part).update("\u0000");
  return `"${hash.digest("base64url").slice(0, 22)}"`;
}

/** The opaque part of a tag, for weak comparison (W/"x" and "x" compare equal, RFC 9110 §8.8.3.2). */
function opaque(tag: string): string {
  const t = tag.trim();
  return t.startsWith("W/") ? t.slice(2) : t;
}

/**
 * Whether an If-None-Match header matches `etag`: "*" matches any current representation, and
 * otherwise any tag in the comma-separated list by weak comparison, as RFC 9110 §13.1.2 says a
 * GET must be evaluated. A header that is absent or empty never matches.
 */
export function ifNoneMatchHits(header: string | null, etag: string): boolean {
  if (!header) return false;
  if (header.trim() === "*") return true;
  const wanted = opaque(etag);
  return header.split(",").some((tag) => opaque(tag) === wanted);
}
