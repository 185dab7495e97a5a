import { boardValuesStamp, loadBoardValues, type BoardValues } from "@/lib/published/board-values";
import { chooseCoding, encodeBody, MIN_COMPRESS_BYTES, type Coding } from "./content-coding";
import { notFound } from "./errors";
import { etagOf, ifNoneMatchHits } from "./etag";
import { encodedJson, notModified } from "./respond";
import type { BoardValuesResponse, ValuesQuery } from "./schemas/values";

// GET /api/v1/boards/{slug}/values, after its parameters were parsed. The ETag is made from the
// values' freshness stamp and the view asked for, both at hand before any body exists, so:
//  - a matching If-None-Match is a 304 straight from the stamp (on a cold cache: one index lookup);
//  - otherwise the body is built once per stamp and view, as UTF-8 bytes with its ETag, and kept
//    beside the cached values (lib/published/board-values.ts) with a compressed copy per coding
//    made the first time a client asks for it: a hit serialises, hashes and compresses nothing.
// Every coding of a view carries the same ETag, as when Next compressed the body itself: the tag
// names the view's content, and Vary: Accept-Encoding keeps shared caches from mixing the copies.

/** Bump when the response shape changes, so clients holding an old tag get the new body. */
const FORMAT = "values-1";

// Compile-time proof that what lib/published returns is what the response schema describes.
const asResponse = (values: BoardValues): BoardValuesResponse => values;

/** One view's response, as kept beside the cached values. */
type BuiltView = { etag: string; identity: Uint8Array<ArrayBuffer>; encoded: Partial<Record<Coding, Uint8Array<ArrayBuffer>>> };

function viewKey(query: ValuesQuery): string {
  return JSON.stringify([query.revision?.toLowerCase() ?? null, query.family ?? null, query.points ? 1 : 0]);
}

const tagOf = (stamp: string, key: string) => etagOf(FORMAT, stamp, key);

const unknownBoard = (slug: string) => notFound(`No board has the slug "${slug}".`, "slug");

const VARY = "Accept-Encoding";

/** The body in the coding the client accepts; made once per view and coding. */
function bodyFor(view: BuiltView, request: Request): { body: Uint8Array<ArrayBuffer>; coding: Coding | null } {
  const coding = view.identity.byteLength >= MIN_COMPRESS_BYTES ? chooseCoding(request.headers.get("accept-encoding")) : null;
  if (!coding) return { body: view.identity, coding: null };
  view.encoded[coding] ??= new Uint8Array(encodeBody(view.identity, coding));
  return { body: view.encoded[coding], coding };
}

export async function boardValuesResponse(request: Request, slug: string, query: ValuesQuery): Promise<Response> {
  const key = viewKey(query);
  const points = query.points === true;
  const ifNoneMatch = request.headers.get("if-none-match");
  if (ifNoneMatch) {
    const current = await boardValuesStamp(slug, { points });
    if (current === null) throw unknownBoard(slug);
    const etag = current.snapshot?.peek<BuiltView>(key)?.etag ?? tagOf(current.stamp, key);
    // A tag we issued names a view that existed under this stamp, so no filter needs checking here.
    if (ifNoneMatchHits(ifNoneMatch, etag)) {
      const response = notModified(etag);
      response.headers.set("Vary", VARY);
      return response;
    }
  }

  const snapshot = await loadBoardValues(slug, { points });
  if (!snapshot) throw unknownBoard(slug);
  const view = snapshot.view<BuiltView>(key, () => {
    const selected = snapshot.select(query);
    if (!selected.ok) throw notFound(selected.message, selected.field);
    return { etag: tagOf(snapshot.stamp, key), identity: new TextEncoder().encode(JSON.stringify(asResponse(selected.values))), encoded: {} };
  });
  // The snapshot may be newer than the stamp checked above (it changed in between): its own tag
  // is checked too, and is the one sent.
  if (ifNoneMatch && ifNoneMatchHits(ifNoneMatch, view.etag)) {
    const response = notModified(view.etag);
    response.headers.set("Vary", VARY);
    return response;
  }
  const { body, coding } = bodyFor(view, request);
  return encodedJson(view.etag, body, coding);
}
