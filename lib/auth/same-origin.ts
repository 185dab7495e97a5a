import { ApiError } from "@/lib/http/errors";
import { requestHost } from "./client-address";

// A second lock against cross-site requests, beside the session cookie's SameSite=Lax: a browser
// names the page's origin on every POST/PATCH/PUT/DELETE, and it must be this site. Requests
// without an Origin header (curl, server-to-server, tests) are not from a browser page and pass.

const SAFE = new Set(["GET", "HEAD", "OPTIONS"]);

export function assertSameOrigin(request: Request): void {
  if (SAFE.has(request.method)) return;
  const origin = request.headers.get("origin");
  if (!origin) return;
  // X-Forwarded-Host is the client's to write unless a trusted proxy sets it (TRUSTED_PROXY_HOPS)
  const host = requestHost(request.headers);
  let originHost: string | undefined;
  try {
    originHost = new URL(origin).host;
  } catch {
    originHost = undefined;
  }
  if (!host || originHost !== host) throw new ApiError(403, "This request came from another site's page and was refused.");
}
