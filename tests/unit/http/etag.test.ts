import { describe, expect, it } from "vitest";
import { etagOf, ifNoneMatchHits } from "@/lib/http/etag";

// If-None-Match evaluation per RFC 9110 §13.1.2 (weak comparison, "*", comma-separated lists).
describe("etagOf", () => {
  it("is a quoted strong tag that depends on every part and on where the parts split", () => {
    expect(etagOf("a")).toMatch(/^"[A-Za-z0-9_-]{22}"$/);
    expect(etagOf("a")).toBe(etagOf("a"));
    expect(etagOf("a", "b")).not.toBe(etagOf("ab"));
    expect(etagOf("a", "b")).not.toBe(etagOf("b", "a"));
  });
});

describe("ifNoneMatchHits", () => {
  const tag = '"abc"';
  it.each([
    ['"abc"', true],
    ['W/"abc"', true],
    ['"x", "abc"', true],
    ['"x",W/"abc" ', true],
    ["*", true],
    [" * ", true],
    ['"abcd"', false],
    ["abc", false],
    ["", false],
  ])("%j → %s", (header, hit) => expect(ifNoneMatchHits(header, tag)).toBe(hit));

  it("no header never matches", () => expect(ifNoneMatchHits(null, tag)).toBe(false));
  it("a weak tag of ours compares equal to its strong form", () => expect(ifNoneMatchHits('"abc"', 'W/"abc"')).toBe(true));
});
