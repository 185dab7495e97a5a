import { boardValuesStamp, loadBoardValues, type BoardValues } from "@/lib/published/board-values";
import { notFound } from "./errors";
import { etagOf, ifNoneMatchHits } from "./etag";
import { jsonWithEtag, notModified } from "./respond";
import type { BoardValuesResponse, ValuesQuery } from "./schemas/values";

// GET /api/v1/boards/{slug}/values, after its parameters were parsed. The ETag is made from the
// values' freshness stamp and the view asked for, both at hand before any body exists, so:
//  - a matching If-None-Match is a 304 straight from the stamp (on a cold cache: one small query);
//  - otherwise the body text is built once per stamp and view and then served from memory.

/** Bump when the response shape changes, so clients holding an old tag get the new body. */
const FORMAT = "values-1";

// Compile-time proof that what lib/published returns is what the response schema describes.
const asResponse = (values: BoardValues): BoardValuesResponse => values;

function viewKey(query: ValuesQuery): string {
  return JSON.stringify([query.revision?.toLowerCase() ?? null, query.family ?? null, query.points ? 1 : 0]);
}

const unknownBoard = (slug: string) => notFound(`No board has the slug "${slug}".`, "slug");

export async function boardValuesResponse(request: Request, slug: string, query: ValuesQuery): Promise<Response> {
  const key = viewKey(query);
  const stamp = await boardValuesStamp(slug);
  if (stamp === null) throw unknownBoard(slug);
  const etag = etagOf(FORMAT, stamp, key);
  // A tag we issued names a view that existed under this stamp, so no filter needs checking here.
  if (ifNoneMatchHits(request.headers.get("if-none-match"), etag)) return notModified(etag);

  const snapshot = await loadBoardValues(slug);
  if (!snapshot) throw unknownBoard(slug);
  // The snapshot may be newer than the stamp above (it changed in between): tag what is sent.
  const sentTag = snapshot.stamp === stamp ? etag : etagOf(FORMAT, snapshot.stamp, key);
  const body = snapshot.serialised(key, () => {
    const view = snapshot.select(query);
    if (!view.ok) throw notFound(view.message, view.field);
    return JSON.stringify(asResponse(view.values));
  });
  return jsonWithEtag(request, sentTag, body);
}
