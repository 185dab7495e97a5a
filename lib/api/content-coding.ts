import { brotliCompressSync, constants, gzipSync } from "node:zlib";

// Content codings for bodies the API keeps in memory (lib/api/values-response.ts). Next compresses
// every response itself when the client accepts gzip, once per request (on a 13 KB body that cost
// a third of the lookup's throughput: finding 6 in docs/benchmarks.md). A body that is built once
// and served many times is better compressed once: the copy is kept beside the body and sent with
// its Content-Encoding, which Next's compression then leaves alone ("already encoded").

export type Coding = "br" | "gzip";

/** Below this a compressed copy saves less than its headers cost (the size Next's own compression starts at). */
export const MIN_COMPRESS_BYTES = 1024;

/** The q-value a coding is given in an Accept-Encoding header (RFC 9110 §12.5.3): explicit, else "*", else 0. */
function qualityOf(header: string, coding: Coding): number {
  let star: number | null = null;
  for (const part of header.split(",")) {
    const [name, ...params] = part.trim().toLowerCase().split(";");
    const qParam = params.map((p) => p.trim()).find((p) => p.startsWith("q="));
    const q = qParam ? Number(qParam.slice(2)) : 1;
    const quality = Number.isFinite(q) ? q : 0;
    if (name.trim() === coding) return quality;
    if (name.trim() === "*") star = quality;
  }
  return star ?? 0;
}

/**
 * The coding to send for this Accept-Encoding header, or null for the identity. Brotli when the
 * client ranks it at least as high as gzip (every current browser sends both), since its copy is
 * smaller and is made only once.
 */
export function chooseCoding(header: string | null): Coding | null {
  if (!header) return null;
  const br = qualityOf(header, "br");
  const gzip = qualityOf(header, "gzip");
  if (br > 0 && br >= gzip) return "br";
  if (gzip > 0) return "gzip";
  return null;
}

/**
 * The body in `coding`. Brotli at quality 5, not the maximum 11: nearly as small on JSON and many
 * times faster, which matters because the first reader of a view waits for it.
 */
export function encodeBody(bytes: Uint8Array, coding: Coding): Buffer {
  if (coding === "gzip") return gzipSync(bytes, { level: 6 });
  return brotliCompressSync(bytes, {
    params: {
      [constants.BROTLI_PARAM_QUALITY]: 5,
      [constants.BROTLI_PARAM_MODE]: constants.BROTLI_MODE_TEXT,
      [constants.BROTLI_PARAM_SIZE_HINT]: bytes.byteLength,
    },
  });
}
