import { describe, expect, it } from "vitest";
import { roleSatisfies } from "@/lib/auth/roles";
import { safeNextPath, signInPath } from "@/lib/auth/safe-next";
import { parseCookieHeader, sessionTokenFrom } from "@/lib/auth/session-cookie";

describe("role ranking", () => {
  it("admin passes every check a moderator passes; a contributor passes only contributor checks", () => {
    expect(roleSatisfies("admin", ["moderator"])).toBe(true);
    expect(roleSatisfies("admin", ["contributor"])).toBe(true);
    expect(roleSatisfies("moderator", ["moderator"])).toBe(true);
    expect(roleSatisfies("moderator", ["admin"])).toBe(false);
    expect(roleSatisfies("contributor", ["moderator"])).toBe(false);
    expect(roleSatisfies("contributor", ["moderator", "contributor"])).toBe(true);
    expect(roleSatisfies("contributor", [])).toBe(true);
  });
});

describe("where sign-in sends you back to (open-redirect guard)", () => {
  it("keeps paths on this site", () => {
    expect(safeNextPath("/boards/x?tab=2#v")).toBe("/boards/x?tab=2#v");
    expect(signInPath("/profile")).toBe("/signin?next=%2Fprofile");
  });
  it("refuses other origins and odd values (OWASP unvalidated-redirects cheat sheet patterns, from memory)", () => {
    for (const bad of ["//evil.test", "/\\evil.test", "https://evil.test", "javascript:alert(1)", "", "/a\nb", 42, undefined]) {
      expect(safeNextPath(bad)).toBe("/profile");
    }
  });
});

describe("session cookie reading", () => {
  it("parses a Cookie header (RFC 6265 §5.4) and takes the first of duplicate names", () => {
    const jar = parseCookieHeader("a=1; b=two=2;  a=3 ; junk; =x");
    expect([...jar]).toEqual([
      ["a", "1"],
      ["b", "two=2"],
    ]);
  });
  it("joins next-auth's chunked token in numeric order", () => {
    const jar = new Map([
      ["next-auth.session-token.10", "K"],
      ["next-auth.session-token.2", "C"],
      ["next-auth.session-token.0", "A"],
      ["next-auth.session-token.1", "B"],
    ]);
    expect(sessionTokenFrom(jar)).toBe("ABCK");
    expect(sessionTokenFrom(new Map())).toBeUndefined();
  });
});
