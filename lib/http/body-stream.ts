import { contentTooLarge, type ApiError } from "./errors";

// The one way a request body is read: as it streams, never past its cap. A body with a
// Content-Length over the cap is refused before a byte is read (Node then discards what the client
// still sends, keeping the connection, so a browser's upload gets the answer cleanly); one without
// (chunked) is read chunk by chunk and refused the moment it passes the cap, so memory holds at most
// the cap plus one chunk whatever the client sends, and the connection is closed after the 413
// rather than drained. Request.text(), .json(), .formData() and .arrayBuffer() read the whole body
// first, so no route reads a request with them.

export type TooLarge = (maxBytes: number) => ApiError;

/** "8 kB", "256 kB", "8.1 MB": caps are binary units, as the platform counts them. */
function formatCap(maxBytes: number): string {
  return maxBytes < 1024 * 1024 ? `${Math.round(maxBytes / 1024)} kB` : `${Number((maxBytes / (1024 * 1024)).toFixed(1))} MB`;
}

const bodyTooLarge: TooLarge = (maxBytes) => contentTooLarge(`The body is larger than ${formatCap(maxBytes)}, the limit here.`);

/** Refusals that stopped a body mid-stream: their answer closes the connection (lib/http/respond.ts). */
const leftUnread = new WeakSet<ApiError>();

/** Whether `error` refused a body part-way through, leaving the rest of it in the socket. */
export function refusedMidStream(error: ApiError): boolean {
  return leftUnread.has(error);
}

/** Stops reading without draining: the rest stays in the client's socket, closed after the 413. */
function abandon(reader: ReadableStreamDefaultReader<Uint8Array>, error: ApiError): ApiError {
  // releaseLock, not cancel: cancelling the platform's stream destroys the socket before the 413
  // can be written (Node destroys an unfinished IncomingMessage's socket); tried against next start.
  reader.releaseLock();
  leftUnread.add(error);
  return error;
}

/**
 * The body's bytes, at most `maxBytes`; ApiError 413 (from `tooLarge`) once it is larger, read
 * no further than the chunk that crossed the cap.
 */
export async function readBodyBytes(request: Request, maxBytes: number, tooLarge: TooLarge = bodyTooLarge): Promise<Uint8Array> {
  const announced = Number(request.headers.get("content-length") ?? "");
  if (Number.isFinite(announced) && announced > maxBytes) throw tooLarge(maxBytes);
  if (!request.body) return new Uint8Array(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) throw abandon(reader, tooLarge(maxBytes));
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, at);
    at += chunk.byteLength;
  }
  return bytes;
}

/** The body as UTF-8 text (bad sequences become U+FFFD), capped as readBodyBytes. */
export async function readBodyText(request: Request, maxBytes: number, tooLarge: TooLarge = bodyTooLarge): Promise<string> {
  return new TextDecoder().decode(await readBodyBytes(request, maxBytes, tooLarge));
}
