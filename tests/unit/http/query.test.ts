import { describe, expect, it } from "vitest";
import { parseQuery, queryRecord } from "@/lib/http/query";
import { ValuesQuerySchema } from "@/lib/published/api-schemas";

const record = (qs: string) => queryRecord(new Request(`http://test.local/x?${qs}`));

describe("queryRecord", () => {
  it("keeps single values as strings and repeated ones as arrays", () => {
    expect(record("a=1&b=2&b=3&c=")).toEqual({ a: "1", b: ["2", "3"], c: "" });
  });
});

describe("parseQuery with the values parameters", () => {
  const parse = (qs: string) => parseQuery(ValuesQuerySchema, record(qs));

  it("reads points as a boolean and trims the filters", () => {
    expect(parse("points=1&revision=%20v2%20&family=vornel")).toEqual({ ok: true, params: { points: true, revision: "v2", family: "vornel" } });
    expect(parse("points=false")).toEqual({ ok: true, params: { points: false } });
  });

  it("treats empty values as absent and ignores unknown parameters", () => {
    expect(parse("points=&revision=&utm=x")).toEqual({ ok: true, params: {} });
  });

  it("names each bad parameter", () => {
    const result = parse("points=maybe&family=Bad_Slug");
    expect(result.ok).toBe(false);
    if (!result.ok) expect(Object.keys(result.fieldErrors).sort()).toEqual(["family", "points"]);
  });

  it("rejects a repeated parameter, but not a repeat that is empty", () => {
    expect(parse("points=1&points=0")).toEqual({ ok: false, fieldErrors: { points: ["points was given 2 times; give it once"] } });
    expect(parse("points=1&points=")).toEqual({ ok: true, params: { points: true } });
  });
});
