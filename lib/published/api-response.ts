import { boardValuesStamp, loadBoardValues, type BoardValues } from "@/lib/published/board-values";
import { notFound } from "@/lib/http/errors";
import { etagOf, ifNoneMatchHits } from "@/lib/http/etag";
import { notModified, varyingJson } from "@/lib/http/respond";
import type { BoardValuesResponse, ValuesQuery } from "./api-schemas";

// GET /api/v1/boards/{slug}/values, after its parameters were parsed. The ETag is made from the
// values' freshness stamp and the view asked for, both at hand before any body exists, so:
//  - a matching If-None-Match is a 304 straight from the stamp (on a cold cache: one index lookup);
//  - otherwise the body is built once per stamp and view, as UTF-8 bytes with its ETag, and kept
//    beside the cached values (lib/published/board-values.ts): a hit serialises and hashes nothing.
// Compression is left to Next (gzip per response when the client accepts it). A compressed copy
// kept beside the body cannot be served from a route handler: Next 16 drops a handler's
// Content-Encoding (next/dist/server/send-response.js, FORBIDDEN_HEADERS) and would gzip the
// compressed bytes again. See finding 6 in docs/benchmarks.md. Vary: Accept-Encoding is set here
// as well, so that the 304s say it too.

/** Bump when the response shape changes, so clients holding an old tag get the new body. */
const FORMAT = "values-1";

// Compile-time proof that what lib/published returns is what the response schema describes.
const asResponse = (values: BoardValues): BoardValuesResponse => values;

/** One view's response, as kept beside the cached values. */
type BuiltView = { etag: string; body: Uint8Array<ArrayBuffer> };

function viewKey(query: ValuesQuery): string {
  return JSON.stringify([query.revision?.toLowerCase() ?? null, query.family ?? null, query.points ? 1 : 0]);
}

const tagOf = (stamp: string, key: string) => etagOf(FORMAT, stamp, key);

const unknownBoard = (slug: string) => notFound(`No board has the slug "${slug}".`, "slug");

/** 304 for a body that Next may have compressed: Vary as on the 200 it stands for. */
function notModifiedVarying(etag: string): Response {
  const response = notModified(etag);
  response.headers.set("Vary", "Accept-Encoding");
  return response;
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
    if (ifNoneMatchHits(ifNoneMatch, etag)) return notModifiedVarying(etag);
  }

  const snapshot = await loadBoardValues(slug, { points });
  if (!snapshot) throw unknownBoard(slug);
  const view = snapshot.view<BuiltView>(key, () => {
    const selected = snapshot.select(query);
    if (!selected.ok) throw notFound(selected.message, selected.field);
    return { etag: tagOf(snapshot.stamp, key), body: new TextEncoder().encode(JSON.stringify(asResponse(selected.values))) };
  });
  // The snapshot may be newer than the stamp checked above (it changed in between): its own tag
  // is checked too, and is the one sent.
  if (ifNoneMatch && ifNoneMatchHits(ifNoneMatch, view.etag)) return notModifiedVarying(view.etag);
  return varyingJson(view.etag, view.body);
}
