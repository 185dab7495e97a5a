import type { StoredResponse } from "./bare-server";

// Before the lookup is measured, every board's values are fetched once, side by side. That warms
// the app the way traffic would, gives each path the ETag that run (b) sends back in
// If-None-Match, and gives the bare server (d) the exact bytes and headers to answer with.

/** Headers that shape what a client receives; the rest (Date, Connection, Vary …) are per response. */
const KEPT_HEADERS = ["content-type", "etag", "cache-control", "access-control-allow-origin", "access-control-expose-headers"];

export type Recorded = StoredResponse & { etag: string };

export async function recordResponses(baseUrl: string, paths: readonly string[], concurrency = 8): Promise<Map<string, Recorded>> {
  const out = new Map<string, Recorded>();
  const failures: string[] = [];
  let next = 0;
  const worker = async () => {
    while (next < paths.length) {
      const path = paths[next++];
      const response = await fetch(baseUrl + path);
      const body = await response.text();
      const etag = response.headers.get("etag");
      if (response.status !== 200 || !etag) {
        failures.push(`${path}: ${response.status}${etag ? "" : " without an ETag"} ${body.slice(0, 200)}`);
        continue;
      }
      const headers = Object.fromEntries(KEPT_HEADERS.flatMap((h) => (response.headers.has(h) ? [[h, response.headers.get(h)!]] : [])));
      out.set(path, { headers, body, etag });
    }
  };
  await Promise.all(Array.from({ length: Math.min(concurrency, paths.length) }, worker));
  if (failures.length) throw new Error(`${failures.length} of ${paths.length} lookups failed while warming up, e.g.\n  ${failures.slice(0, 3).join("\n  ")}`);
  return out;
}
