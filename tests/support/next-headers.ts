import { AsyncLocalStorage } from "node:async_hooks";
import { createRequire } from "node:module";
import { RequestCookies } from "next/dist/server/web/spec-extension/cookies";

// A stand-in for `next/headers` in vitest. Outside a Next.js server, the real cookies() and
// headers() throw ("called outside a request scope"); this one answers from the Request that the
// test is "handling" (see inRequest / callRoute in tests/support/auth.ts). Use it with, at the top
// of the test file:
//
//   vi.mock("next/headers", () => import("@/tests/support/next-headers"));
//
// Outside any inRequest scope both return an empty request (an anonymous caller with no headers).
// Packages that load next/headers with require() (next-auth does, inside its route handler) do
// not go through vi.mock, so the CommonJS module's exports are pointed here too (end of file).

type Scope = { headers: Headers; cookies: RequestCookies };
const scope = new AsyncLocalStorage<Scope>();

function current(): Scope {
  const s = scope.getStore();
  if (s) return s;
  const headers = new Headers();
  return { headers, cookies: new RequestCookies(headers) };
}

/** Runs fn as if Next.js were serving `request`: cookies() and headers() read from it. */
export function runWithRequest<T>(request: Request, fn: () => T): T {
  const headers = new Headers(request.headers);
  return scope.run({ headers, cookies: new RequestCookies(headers) }, fn);
}

export async function cookies(): Promise<RequestCookies> {
  return current().cookies;
}

export async function headers(): Promise<Headers> {
  return current().headers;
}

export async function draftMode() {
  return { isEnabled: false, enable() {}, disable() {} };
}

// next/headers is a CommonJS module with plain assignable exports; one object is shared by every
// require() of it in this test process
const commonJs = createRequire(import.meta.url)("next/headers") as Record<string, unknown>;
Object.assign(commonJs, { cookies, headers, draftMode });
