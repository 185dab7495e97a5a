import { isIP } from "node:net";
import { env } from "@/lib/env";

// The caller's address, for rate limits. A Next.js route handler never sees the socket: Next's
// server copies the socket's address into X-Forwarded-For only when the request has no such
// header (node_modules/next/dist/server/base-server.js, `x-forwarded-for ??= socket.remoteAddress`),
// so a client that sends its own header would choose its address. The launcher therefore loads
// lib/platform/peer-address.cjs into the app's server, which appends the socket's address to
// X-Forwarded-For on every request, as a proxy does. The right-most entry is then always the
// peer's, and each trusted proxy in front (TRUSTED_PROXY_HOPS) moves the client one entry left.
// Entries left of those are the client's own words and are never read.

/** Entries of every X-Forwarded-For header, in order (Headers joins repeated headers with ", "). */
function forwardedFor(headers: Headers): string[] {
  return (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((entry) => entry.trim())
    .filter(Boolean);
}

/** An IPv4 client of a dual-stack socket is reported as ::ffff:a.b.c.d; one address, one key. */
function normalise(address: string): string {
  const bare = address.replace(/^::ffff:(?=\d+\.\d+\.\d+\.\d+$)/i, "");
  return isIP(bare) ? bare.toLowerCase() : "unknown";
}

/** The address `hops` entries left of the right-most X-Forwarded-For entry; "unknown" without one. */
export function clientAddress(headers: Headers, hops: number = env().TRUSTED_PROXY_HOPS): string {
  const entries = forwardedFor(headers);
  if (!entries.length) return "unknown";
  // fewer entries than proxies: the request skipped a proxy; the left-most entry is still one a proxy or the peer wrote
  return normalise(entries[Math.max(0, entries.length - 1 - hops)]);
}

/** The Host the browser addressed: the Host header, or with trusted proxies the one the outermost of them reports. */
export function requestHost(headers: Headers, hops: number = env().TRUSTED_PROXY_HOPS): string | null {
  if (hops > 0) {
    const forwarded = (headers.get("x-forwarded-host") ?? "")
      .split(",")
      .map((h) => h.trim())
      .filter(Boolean);
    if (forwarded.length) return forwarded[Math.max(0, forwarded.length - hops)];
  }
  return headers.get("host");
}
