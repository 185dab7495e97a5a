import fc from "fast-check";

// Bad request bodies for the fuzz test (tests/integration/fuzz-bodies.test.ts and `npm run fuzz`):
// objects whose every value is wrong for any field of that name, JSON that is not an object, text
// that is not JSON, and the wrong Content-Type. The field names are the API's own (lib/*/schemas),
// so a body reaches the field checks instead of stopping at "send an object".

const FIELDS = [
  "name",
  "label",
  "notes",
  "esc",
  "firmwareVersion",
  "boardRevisionId",
  "firmwareFamilyId",
  "quadId",
  "kind",
  "ratedMah",
  "cells",
  "startingScale",
  "scaleUsed",
  "reportedMah",
  "chargedMah",
  "fullyRecharged",
  "chemistry",
  "purchasedOn",
  "chargedOn",
  "restingVoltsPerCell",
  "afterFullFlight",
  "version",
  "note",
  "reason",
  "message",
  "role",
  "ids",
  "items",
  "trusted",
  "sensingSource",
  "method",
  "voltageScale",
  "currentScale",
  "currentOffset",
  "cycles",
  "bench",
  "voltageCheck",
  "photoIds",
  "readings",
  "points",
  "measuredVolts",
  "reportedVolts",
  "clampAmps",
  "reportedAmps",
  "submissionId",
  "id",
  "__proto__",
  "constructor",
];

const CONTROL = fc.constantFrom("\u0000", "\u0007", "\b", "\u001b", "\u007f", "\u0085", "\u009b");
/** Text no field accepts: a control character inside, blank, or longer than any limit (10,000 for notes). */
const badText = fc.oneof(
  fc.tuple(fc.string({ maxLength: 12 }), CONTROL, fc.string({ maxLength: 12 })).map(([a, c, b]) => `${a}${c}${b}`),
  fc.constantFrom("", "   ", "\u0000"),
  fc.integer({ min: 10_001, max: 40_000 }).map((n) => "x".repeat(n)),
);
/** Numbers past every range: negative, zero, fractions of counts, past int4 and past doubles' safe integers. */
const badNumber = fc.oneof(
  fc.constantFrom(-1, 0, -0.5, 0.25, 3_000_000_000, 2 ** 31, -(2 ** 31) - 1, 2 ** 53, 1e308, -1e308, Number.MIN_VALUE),
  fc.integer({ min: 2 ** 31, max: Number.MAX_SAFE_INTEGER }),
  fc.integer({ min: -Number.MAX_SAFE_INTEGER, max: -1 }),
);
const badDate = fc.constantFrom("0000-01-01", "0001-01-01", "1899-12-31", "9999-12-31", "2026-02-30", "2026-13-01", "yesterday", "2026-01-01T00:00:00Z");
/** Containers nested deeper than any schema reads (the idempotency hash once recursed on them). */
const deep = fc.integer({ min: 20, max: 300 }).map((depth) => {
  let v: unknown = 1;
  for (let i = 0; i < depth; i++) v = i % 2 ? { a: v } : [v];
  return v;
});
const badValue = fc.oneof(badText, badNumber, badDate, fc.constantFrom(null, true, false, [], {}, [null], ["\u0000"]), deep);

const badObject = fc.dictionary(fc.constantFrom(...FIELDS), badValue, { minKeys: 1, maxKeys: 8 });

export type BadBody = { contentType: string; text: string };

const asJson = (value: unknown): string => JSON.stringify(value) ?? "null";

export const badBodies: fc.Arbitrary<BadBody> = fc.oneof(
  { weight: 6, arbitrary: badObject.map((o) => ({ contentType: "application/json", text: asJson(o) })) },
  {
    weight: 2,
    arbitrary: fc
      .jsonValue({ maxDepth: 3 })
      .filter((v) => v === null || typeof v !== "object" || Array.isArray(v))
      .map((v) => ({ contentType: "application/json", text: asJson(v) })),
  },
  {
    weight: 1,
    arbitrary: fc
      .string({ maxLength: 40 })
      .filter((s) => {
        try {
          JSON.parse(s);
          return false;
        } catch {
          return true;
        }
      })
      .map((text) => ({ contentType: "application/json; charset=utf-8", text })),
  },
  {
    weight: 1,
    arbitrary: fc
      .tuple(fc.constantFrom("text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x", "", "application/jsonx"), badObject)
      .map(([contentType, o]) => ({ contentType, text: asJson(o) })),
  },
);
