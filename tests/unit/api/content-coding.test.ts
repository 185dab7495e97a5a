import { brotliDecompressSync, gunzipSync } from "node:zlib";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { chooseCoding, encodeBody } from "@/lib/api/content-coding";

// Accept-Encoding as RFC 9110 §12.5.3 defines it (q-values, "*", q=0 meaning "not acceptable"),
// and the compressed copies decoding back to the very bytes (node:zlib both ways).
describe("chooseCoding", () => {
  it("prefers br when the client ranks it at least as high as gzip, as browsers do", () => {
    expect(chooseCoding("gzip, deflate, br, zstd")).toBe("br");
    expect(chooseCoding("br")).toBe("br");
    expect(chooseCoding("BR;q=0.9, gzip;q=0.9")).toBe("br");
  });
  it("falls back to gzip when br is missing, refused or ranked lower", () => {
    expect(chooseCoding("gzip, deflate")).toBe("gzip");
    expect(chooseCoding("br;q=0, gzip")).toBe("gzip");
    expect(chooseCoding("br;q=0.5, gzip")).toBe("gzip");
    expect(chooseCoding("*;q=0.1, br;q=0")).toBe("gzip");
  });
  it("sends the identity when nothing we make is acceptable", () => {
    expect(chooseCoding(null)).toBeNull();
    expect(chooseCoding("")).toBeNull();
    expect(chooseCoding("identity")).toBeNull();
    expect(chooseCoding("deflate")).toBeNull();
    expect(chooseCoding("gzip;q=0, br;q=0")).toBeNull();
    expect(chooseCoding("gzip;q=abc")).toBeNull();
  });
  it("takes '*' for any coding not named", () => {
    expect(chooseCoding("*")).toBe("br");
    expect(chooseCoding("*;q=0")).toBeNull();
  });
});

describe("encodeBody", () => {
  it("gzip and br copies decode to the same JSON text (generated)", () => {
    fc.assert(
      fc.property(fc.jsonValue(), (value) => {
        const bytes = new TextEncoder().encode(JSON.stringify(value));
        expect(gunzipSync(encodeBody(bytes, "gzip")).equals(Buffer.from(bytes))).toBe(true);
        expect(brotliDecompressSync(encodeBody(bytes, "br")).equals(Buffer.from(bytes))).toBe(true);
      }),
      { numRuns: 100 },
    );
  });
});
