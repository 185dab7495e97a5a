import { describe, expect, it } from "vitest";
import { clientAddress, requestHost } from "@/lib/auth/client-address";
import { FREE_FAILURES, lockSeconds } from "@/lib/auth/account-lock";

// Addresses are RFC 5737 / RFC 3849 documentation addresses. The right-most X-Forwarded-For entry
// is the peer's, stamped by lib/platform/peer-address.cjs; each trusted proxy hop moves one left.
const headers = (init: Record<string, string>) => new Headers(init);

describe("clientAddress", () => {
  it("without trusted proxies, the right-most entry: whatever the client wrote before it is ignored", () => {
    expect(clientAddress(headers({ "x-forwarded-for": "10.0.0.1, 192.0.2.7" }), 0)).toBe("192.0.2.7");
    expect(clientAddress(headers({ "x-forwarded-for": "::ffff:192.0.2.8" }), 0)).toBe("192.0.2.8");
    expect(clientAddress(headers({ "x-forwarded-for": "2001:DB8::1" }), 0)).toBe("2001:db8::1");
  });
  it("with one trusted proxy, the entry that proxy wrote", () => {
    expect(clientAddress(headers({ "x-forwarded-for": "10.0.0.1, 203.0.113.5, 192.0.2.1" }), 1)).toBe("203.0.113.5");
    expect(clientAddress(headers({ "x-forwarded-for": "192.0.2.1" }), 2)).toBe("192.0.2.1");
  });
  it("no header or a non-address is 'unknown'", () => {
    expect(clientAddress(headers({}), 0)).toBe("unknown");
    expect(clientAddress(headers({ "x-forwarded-for": "not-an-ip" }), 0)).toBe("unknown");
  });
  it("the host is the Host header unless a proxy is trusted", () => {
    const h = headers({ host: "127.0.0.1:3000", "x-forwarded-host": "evil.test" });
    expect(requestHost(h, 0)).toBe("127.0.0.1:3000");
    expect(requestHost(h, 1)).toBe("evil.test");
  });
});

describe("lockSeconds (growing delay per account)", () => {
  it("nothing before FREE_FAILURES, then doubling from 30 s to at most 15 min", () => {
    expect(lockSeconds(FREE_FAILURES - 1)).toBe(0);
    expect([FREE_FAILURES, FREE_FAILURES + 1, FREE_FAILURES + 2].map(lockSeconds)).toEqual([30, 60, 120]);
    expect(lockSeconds(FREE_FAILURES + 20)).toBe(900);
  });
});
