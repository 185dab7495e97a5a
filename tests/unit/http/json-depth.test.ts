import { describe, expect, it } from "vitest";
import { MAX_JSON_DEPTH, nestsDeeperThan } from "@/lib/http/json-depth";

// The depth scan that runs before JSON.parse (lib/http/json-body.ts). Strings and escapes as in
// RFC 8259 §7: a string ends at an unescaped quote; brackets inside one are text.

describe("nestsDeeperThan", () => {
  const objects = (depth: number) => '{"a":'.repeat(depth) + "1" + "}".repeat(depth);
  const arrays = (depth: number) => "[".repeat(depth) + "]".repeat(depth);

  it("counts objects and arrays, mixed, and allows exactly the limit", () => {
    expect(nestsDeeperThan(objects(MAX_JSON_DEPTH), MAX_JSON_DEPTH)).toBe(false);
    expect(nestsDeeperThan(objects(MAX_JSON_DEPTH + 1), MAX_JSON_DEPTH)).toBe(true);
    expect(nestsDeeperThan(arrays(MAX_JSON_DEPTH + 1), MAX_JSON_DEPTH)).toBe(true);
    expect(nestsDeeperThan('{"a":[{"b":[1]}]}', 4)).toBe(false);
    expect(nestsDeeperThan('{"a":[{"b":[1]}]}', 3)).toBe(true);
  });

  it("measures depth, not the number of brackets: siblings do not add up", () => {
    const wide = JSON.stringify({ list: Array.from({ length: 1000 }, (_, i) => ({ i, tags: [i] })) });
    expect(nestsDeeperThan(wide, 4)).toBe(false);
  });

  it("ignores brackets inside strings, escaped quotes included", () => {
    expect(nestsDeeperThan(JSON.stringify({ note: "[[[[[[{{{{{" }), 1)).toBe(false);
    expect(nestsDeeperThan(JSON.stringify({ note: 'say "[[[[" and \\ then [[[[' }), 1)).toBe(false);
    // after a string with an escaped backslash at its end, brackets count again
    expect(nestsDeeperThan('{"a":"x\\\\","b":[[1]]}', 2)).toBe(true);
  });

  it("stays linear on a 5,000-deep body and needs no stack", () => {
    expect(nestsDeeperThan(arrays(5_000), MAX_JSON_DEPTH)).toBe(true);
    expect(nestsDeeperThan(" ".repeat(1_000_000), MAX_JSON_DEPTH)).toBe(false);
  });
});
