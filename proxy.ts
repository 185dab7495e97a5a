import { NextResponse, type NextRequest } from "next/server";
import { env } from "@/lib/env";
import { newNonce, pagePolicy } from "@/lib/http/security-headers";

// Next.js 16 runs this before every page request (the file convention that replaced middleware.ts;
// the matcher keeps API routes and static files out, see next.config.mjs). A page request gets a
// fresh nonce and its page policy (lib/http/security-headers.ts): it goes into the request's Content-Security-Policy header,
// where Next.js finds it and puts it on its own scripts, and into x-nonce, which the root layout
// reads for its one inline script. Reading it makes every page render per request: a page
// prerendered at build time would carry no nonce and its scripts would be refused.

export function proxy(request: NextRequest): NextResponse {
  const e = env();
  const nonce = newNonce();
  const policy = pagePolicy({ nonce, development: e.NODE_ENV === "development", https: e.NEXTAUTH_URL?.startsWith("https://") ?? false });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("Content-Security-Policy", policy);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("Content-Security-Policy", policy);
  return response;
}

// Pages only: API requests must reach their route with the body unread (see next.config.mjs), and
// static files need no nonce. Their fixed headers come from next.config.mjs.
export const config = { matcher: ["/((?!api/|api$|_next/static/|_next/image).*)"] };
