import { describe, expect, it } from "vitest";
import { RESOURCE_POLICY, pagePolicy } from "@/lib/http/security-headers";

// Issue 12, finding 7 / deliver 6: browser security headers on every response of the built app
// (npm test serves it at SHUNTBOOK_TEST_APP_URL). Sources for what each header must say: MDN
// (Content-Security-Policy, X-Content-Type-Options, X-Frame-Options, Referrer-Policy,
// Permissions-Policy) and the Next.js 16 guide on CSP nonces with proxy.ts.
const appUrl = process.env.SHUNTBOOK_TEST_APP_URL;

const directive = (policy: string, name: string) =>
  policy
    .split(";")
    .map((d) => d.trim())
    .find((d) => d.split(/\s+/)[0] === name);

function expectCommonHeaders(res: Response): string {
  expect(res.headers.get("x-content-type-options")).toBe("nosniff");
  expect(res.headers.get("x-frame-options")).toBe("DENY");
  expect(res.headers.get("referrer-policy")).toBe("same-origin");
  expect(res.headers.get("permissions-policy")).toMatch(/camera=\(\)/);
  const policy = res.headers.get("content-security-policy") ?? "";
  expect(directive(policy, "frame-ancestors")).toBe("frame-ancestors 'none'");
  return policy;
}

describe("the policies themselves", () => {
  it("a page's scripts need this response's nonce: no 'unsafe-inline', no 'unsafe-eval' outside next dev", () => {
    const prod = pagePolicy({ nonce: "abc123==", development: false, https: false });
    expect(directive(prod, "script-src")).toBe("script-src 'self' 'nonce-abc123==' 'strict-dynamic'");
    expect(directive(prod, "object-src")).toBe("object-src 'none'");
    expect(directive(prod, "base-uri")).toBe("base-uri 'none'");
    // upgrade-insecure-requests only over https: on http://127.0.0.1 nothing answers https
    expect(prod).not.toMatch(/upgrade-insecure-requests/);
    expect(pagePolicy({ nonce: "n", development: false, https: true })).toMatch(/upgrade-insecure-requests/);
    expect(directive(pagePolicy({ nonce: "n", development: true, https: false }), "script-src")).toMatch(/'unsafe-eval'/);
  });

  it("JSON and files may run nothing", () => {
    expect(directive(RESOURCE_POLICY, "default-src")).toBe("default-src 'none'");
  });
});

describe.skipIf(!appUrl)("security headers from next start", () => {
  const get = (path: string, init?: RequestInit) => fetch(new URL(path, appUrl), { redirect: "manual", ...init });

  it("pages carry a strict CSP whose nonce is on every script Next.js writes, fresh per request", async () => {
    const nonces: string[] = [];
    for (const path of ["/", "/boards", "/signin"]) {
      const res = await get(path);
      expect(res.status).toBe(200);
      const policy = expectCommonHeaders(res);
      const nonce = /'nonce-([^']+)'/.exec(directive(policy, "script-src") ?? "")?.[1];
      expect(nonce, `${path}: script-src has a nonce`).toBeTruthy();
      nonces.push(nonce!);
      const html = await res.text();
      const scripts = html.match(/<script\b[^>]*>/g) ?? [];
      expect(scripts.length, `${path}: Next.js writes scripts`).toBeGreaterThan(1);
      for (const tag of scripts) expect(tag, `${path}: ${tag}`).toContain(`nonce="${nonce}"`);
      // the browser then loads the page's chunks: served with nosniff and a locked-down policy
      const chunk = /<script\b[^>]*\bsrc="(\/_next\/static\/[^"]+\.js)"/.exec(html)?.[1];
      expect(chunk).toBeTruthy();
      const js = await get(chunk!);
      expect(js.status).toBe(200);
      expectCommonHeaders(js);
      await js.arrayBuffer();
    }
    expect(new Set(nonces).size).toBe(nonces.length);
  });

  it("a page that is not found carries them too", async () => {
    const res = await get("/no-such-page-anywhere");
    expect(res.status).toBe(404);
    expect(directive(expectCommonHeaders(res), "script-src")).toMatch(/'nonce-/);
    await res.text();
  });

  it("API answers (success, refusal, error) carry them, with a policy that runs nothing", async () => {
    for (const [path, status] of [
      ["/api/v1/boards?pageSize=1", 200],
      ["/api/v1/boards?page=abc", 400],
      ["/api/v1/garage/quads", 401],
      ["/api/v1/photos/1", 404],
      ["/api/v1/no-such-endpoint", 404],
    ] as const) {
      const res = await get(path);
      expect(res.status, path).toBe(status);
      expect(directive(expectCommonHeaders(res), "default-src"), path).toBe("default-src 'none'");
      await res.text();
    }
  });

  it("cookies are not Secure on the http:// test server (next-auth sets Secure and __Secure- exactly when NEXTAUTH_URL is https)", async () => {
    const res = await get("/api/auth/csrf");
    const cookies = res.headers.getSetCookie();
    expect(cookies.length).toBeGreaterThan(0);
    for (const c of cookies) expect(c).not.toMatch(/;\s*Secure/i);
    expectCommonHeaders(res);
    await res.text();
  });
});
