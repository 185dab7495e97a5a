import { NextResponse, type NextRequest } from "next/server";
import { env } from "@/lib/env";
import { RESOURCE_POLICY, STATIC_SECURITY_HEADERS, isResourcePath, newNonce, pagePolicy } from "@/lib/http/security-headers";

// Next.js 16 runs this before every request (the file convention that replaced middleware.ts).
// It puts the browser security headers on every response (lib/http/security-headers.ts). A page
// request also gets a fresh nonce: it goes into the request's Content-Security-Policy header,
// where Next.js finds it and puts it on its own scripts, and into x-nonce, which the root layout
// reads for its one inline script. Reading it makes every page render per request: a page
// prerendered at build time would carry no nonce and its scripts would be refused.

export function proxy(request: NextRequest): NextResponse {
  const { pathname } = request.nextUrl;
  if (isResourcePath(pathname)) {
    const response = NextResponse.next();
    for (const [name, value] of Object.entries(STATIC_SECURITY_HEADERS)) response.headers.set(name, value);
    response.headers.set("Content-Security-Policy", RESOURCE_POLICY);
    return response;
  }
  const e = env();
  const nonce = newNonce();
  const policy = pagePolicy({ nonce, development: e.NODE_ENV === "development", https: e.NEXTAUTH_URL?.startsWith("https://") ?? false });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("Content-Security-Policy", policy);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  for (const [name, value] of Object.entries(STATIC_SECURITY_HEADERS)) response.headers.set(name, value);
  response.headers.set("Content-Security-Policy", policy);
  return response;
}
