import fc from "fast-check";
import { QueryTypes } from "sequelize";
import { median as ssMedian, medianAbsoluteDeviation as ssMad } from "simple-statistics";
import { beforeAll, describe, expect, it } from "vitest";
import { GET } from "@/app/api/v1/boards/[slug]/values/route";
import { BoardValuesResponseSchema, type BoardValuesResponse } from "@/lib/published/api-schemas";
import { invalidateBoardValues } from "@/lib/published/board-values";
import { refreshGroups } from "@/lib/published/refresh";
import { flagPoints } from "@/lib/stats";
import { db } from "@/models";
import { setupTestDatabase } from "@/tests/support/database";

// GET /api/v1/boards/{slug}/values, called as Next calls it (a Request and a params promise),
// against a clone of the seeded demo database.
setupTestDatabase("seeded");

const call = (slug: string, query = "", headers: Record<string, string> = {}) =>
  GET(new Request(`http://test.local/api/v1/boards/${encodeURIComponent(slug)}/values${query}`, { headers }), {
    params: Promise.resolve({ slug }),
  });

async function json(res: Response) {
  expect(res.headers.get("content-type")).toMatch(/^application\/json/);
  return res.json();
}

type Quantities = BoardValuesResponse["revisions"][number]["families"][number];
const KEYS = ["voltageScale", "currentScale", "currentOffset"] as const;
const SQL_NAME = { voltageScale: "voltage_scale", currentScale: "current_scale", currentOffset: "current_offset" } as const;

function everyQuantity(body: BoardValuesResponse) {
  return body.revisions.flatMap((r) => r.families.flatMap((g: Quantities) => KEYS.flatMap((k) => (g[k] ? [{ revision: r, group: g, key: k, q: g[k]! }] : []))));
}

let busiest: string; // the board with the most approved values
let bare: string; // a board with no published values at all

beforeAll(async () => {
  const s = db();
  // The seeder computes board_stats; should a template predate that, compute them here.
  const [{ n }] = await s.query<{ n: number }>("SELECT count(*)::int AS n FROM board_stats", { type: QueryTypes.SELECT });
  if (n === 0) await refreshGroups(s, null);
  [{ slug: busiest }] = await s.query<{ slug: string }>(
    `SELECT bm.slug FROM board_models bm JOIN board_revisions br ON br.board_model_id = bm.id
       JOIN submissions su ON su.board_revision_id = br.id AND su.status = 'approved'
      GROUP BY bm.slug ORDER BY count(*) DESC, bm.slug LIMIT 1`,
    { type: QueryTypes.SELECT },
  );
  [{ slug: bare }] = await s.query<{ slug: string }>(
    `SELECT bm.slug FROM board_models bm WHERE NOT EXISTS (
       SELECT 1 FROM board_stats bs JOIN board_revisions br ON br.id = bs.board_revision_id WHERE br.board_model_id = bm.id)
     ORDER BY bm.slug LIMIT 1`,
    { type: QueryTypes.SELECT },
  );
});

describe("GET /api/v1/boards/{slug}/values", () => {
  it("answers 200 with the documented shape and the issue's field names for every quantity", async () => {
    const res = await call(busiest);
    expect(res.status).toBe(200);
    const body = await json(res);
    expect(BoardValuesResponseSchema.safeParse(body).success).toBe(true);
    expect(body.board.slug).toBe(busiest);
    const all = everyQuantity(body);
    expect(all.length).toBeGreaterThan(0);
    for (const { q } of all) {
      for (const field of ["n", "median", "q1", "q3", "mad", "ciLow", "ciHigh", "iqr", "scaledMad", "ciCoverage", "outlierCount", "lastChangeAt"]) {
        expect(q).toHaveProperty(field);
      }
      expect(Object.keys(q.confidence).sort()).toEqual(["explanation", "label", "title"]);
      expect(Number.isInteger(q.recommended.setting)).toBe(true);
      expect(q.points).toBeUndefined();
    }
  });

  it("carries the unit definition of every family it shows", async () => {
    const body = await json(await call(busiest));
    const shown = new Set(body.revisions.flatMap((r: BoardValuesResponse["revisions"][number]) => r.families.map((g) => g.family)));
    expect(new Set(body.families.map((f: { slug: string }) => f.slug))).toEqual(shown);
    for (const f of body.families) {
      expect(["V/V", "mV/V"]).toContain(f.voltageScale.unit);
      expect(["mV/A", "A/V"]).toContain(f.currentScale.unit);
      expect(f.voltageScale.step).toBeGreaterThan(0);
    }
  });

  it("reports exactly what PostgreSQL computed into board_stats", async () => {
    const body: BoardValuesResponse = await json(await call(busiest));
    const rows = await db().query<Record<string, unknown>>(
      `SELECT br.label, ff.slug AS family, bs.* FROM board_stats bs
         JOIN board_revisions br ON br.id = bs.board_revision_id JOIN board_models bm ON bm.id = br.board_model_id
         JOIN firmware_families ff ON ff.id = bs.firmware_family_id WHERE bm.slug = $slug`,
      { bind: { slug: busiest }, type: QueryTypes.SELECT },
    );
    const all = everyQuantity(body);
    expect(all.length).toBe(rows.length);
    for (const { revision, group, key, q } of all) {
      const row = rows.find((r) => r.label === revision.label && r.family === group.family && r.quantity === SQL_NAME[key])!;
      expect(row).toBeDefined();
      expect(q.n).toBe(row.n);
      expect(q.median).toBe(row.median);
      expect([q.q1, q.q3, q.mad, q.ciLow, q.ciHigh]).toEqual([row.q1, row.q3, row.mad, row.ci_low, row.ci_high]);
      expect(q.outlierCount).toBe(row.outlier_count);
      expect(q.recommended.setting).toBe(row.recommended_value);
      expect(q.confidence.label).toBe(row.confidence);
      expect(q.lastChangeAt).toBe((row.last_value_at as Date).toISOString());
    }
  });

  it("points=1 adds the approved values, flagged as lib/stats flagPoints flags them", async () => {
    const body: BoardValuesResponse = await json(await call(busiest, "?points=1"));
    for (const { q } of everyQuantity(body)) {
      const points = q.points!;
      expect(points).toHaveLength(q.n);
      for (const p of points) expect(Object.keys(p).sort()).toEqual(["date", "method", "modifiedZ", "outlier", "value"]);
      const expected = flagPoints(points.map((p) => p.value));
      expect(points.map((p) => [p.modifiedZ, p.outlier])).toEqual(expected.map((e) => [e.modifiedZ, e.outlier]));
      // PostgreSQL's count and the TypeScript flags agree (same definition, computed twice)
      expect(points.filter((p) => p.outlier).length).toBe(q.outlierCount);
      // oldest first
      expect([...points].sort((a, b) => a.date.localeCompare(b.date))).toEqual(points);
    }
  });

  it("modifiedZ is NIST's M = 0.6745 (x − median) / MAD, with the median and MAD from simple-statistics", async () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods §1.3.5.17 (Iglewicz & Hoaglin): |M| > 3.5 flags
    // a potential outlier. simple-statistics' medianAbsoluteDeviation is the unscaled MAD.
    const body: BoardValuesResponse = await json(await call(busiest, "?points=1"));
    let checked = 0;
    for (const { q } of everyQuantity(body)) {
      const values = q.points!.map((p) => p.value);
      if (values.length < 3) continue;
      const med = ssMedian(values);
      const mad = ssMad(values);
      expect(q.median).toBeCloseTo(med, 9);
      expect(q.mad).toBeCloseTo(mad, 9);
      if (mad === 0) continue; // lib/stats' own MAD = 0 rule, tested in tests/unit/stats
      for (const p of q.points!) {
        const m = (0.6745 * (p.value - med)) / mad;
        expect(p.modifiedZ).toBeCloseTo(m, 9);
        expect(p.outlier).toBe(Math.abs(m) > 3.5);
        checked += 1;
      }
    }
    expect(checked).toBeGreaterThan(20);
  });

  it("points=0 and points=false leave the points out; points=true puts them in", async () => {
    for (const q of ["?points=0", "?points=false"]) {
      for (const { q: v } of everyQuantity(await json(await call(busiest, q)))) expect(v.points).toBeUndefined();
    }
    for (const { q: v } of everyQuantity(await json(await call(busiest, "?points=true")))) expect(Array.isArray(v.points)).toBe(true);
  });

  it("filters by revision label (any case) and by family slug", async () => {
    const full: BoardValuesResponse = await json(await call(busiest));
    const revision = full.revisions.find((r) => r.families.length > 0)!;
    const family = revision.families[0].family;

    const byRevision: BoardValuesResponse = await json(await call(busiest, `?revision=${encodeURIComponent(revision.label.toUpperCase())}`));
    expect(byRevision.revisions.map((r) => r.label)).toEqual([revision.label]);
    expect(byRevision.revisions[0]).toEqual(revision);

    const both: BoardValuesResponse = await json(await call(busiest, `?revision=${encodeURIComponent(revision.label)}&family=${family}`));
    expect(both.revisions[0].families.map((g) => g.family)).toEqual([family]);
    expect(both.families.map((f) => f.slug)).toEqual([family]);
  });

  it("a board with no approved values answers 200 with empty groups, not 404", async () => {
    const res = await call(bare);
    expect(res.status).toBe(200);
    const body: BoardValuesResponse = await json(res);
    expect(body.families).toEqual([]);
    expect(body.lastChangeAt).toBeNull();
    for (const r of body.revisions) expect(r.families).toEqual([]);
  });
});

describe("GET /api/v1/boards/{slug}/values: errors", () => {
  async function expectError(res: Response, status: number, field?: string) {
    expect(res.status).toBe(status);
    expect(res.headers.get("cache-control")).toBe("no-store");
    expect(res.headers.get("etag")).toBeNull();
    const body = await json(res);
    expect(body.error.status).toBe(status);
    expect(body.error.code).toBe(status === 400 ? "bad_request" : "not_found");
    expect(typeof body.error.message).toBe("string");
    if (field) expect(body.error.fieldErrors[field]?.length).toBeGreaterThan(0);
    return body;
  }

  it("400 naming points for points=maybe", () => call(busiest, "?points=maybe").then((r) => expectError(r, 400, "points")));
  it("400 naming family for a malformed family slug", () => call(busiest, "?family=Not%20A%20Slug").then((r) => expectError(r, 400, "family")));
  it("400 naming revision for a 41-character label", () => call(busiest, `?revision=${"x".repeat(41)}`).then((r) => expectError(r, 400, "revision")));
  it("400 naming points when it is given twice", () => call(busiest, "?points=1&points=0").then((r) => expectError(r, 400, "points")));
  it("404 naming slug for an unknown board", () => call("no-such-board", "").then((r) => expectError(r, 404, "slug")));
  it("404 for a slug that could never exist (upper case, very long)", async () => {
    await expectError(await call(busiest.toUpperCase()), 404, "slug");
    await expectError(await call("a".repeat(500)), 404, "slug");
  });
  it("404 naming revision for a revision the board does not have", async () => {
    const body = await expectError(await call(busiest, "?revision=zz9"), 404, "revision");
    expect(body.error.message).toMatch(/revisions are/);
  });
  it("404 naming family for a family that does not exist", () => call(busiest, "?family=no-such-family").then((r) => expectError(r, 404, "family")));

  it("never answers 500, whatever the query string (generated)", async () => {
    const slugs = fc.constantFrom(busiest, bare, "no-such-board", "", "%", "../boards", "a".repeat(200));
    const value = fc.oneof(fc.string(), fc.constantFrom("1", "0", "v1", "V1.1", "vornel", "-1", "1e9", "%00", "🛩"));
    await fc.assert(
      fc.asyncProperty(slugs, fc.dictionary(fc.constantFrom("points", "revision", "family", "other"), value), async (slug, params) => {
        const res = await call(slug, `?${new URLSearchParams(params)}`);
        expect([200, 400, 404]).toContain(res.status);
        await res.arrayBuffer();
      }),
      { numRuns: 150 },
    );
  });
});

describe("GET /api/v1/boards/{slug}/values: caching", () => {
  it("every read carries an ETag and a public Cache-Control", async () => {
    const res = await call(busiest);
    expect(res.headers.get("etag")).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expect(res.headers.get("cache-control")).toBe("public, max-age=60, stale-while-revalidate=300");
  });

  it("answers 304 with no body to a matching If-None-Match, in any of its valid forms", async () => {
    const etag = (await call(busiest)).headers.get("etag")!;
    for (const header of [etag, `W/${etag}`, `"other", ${etag}`, "*"]) {
      const res = await call(busiest, "", { "if-none-match": header });
      expect(res.status).toBe(304);
      expect(res.headers.get("etag")).toBe(etag);
      expect(res.headers.get("cache-control")).toMatch(/max-age=60/);
      expect(await res.text()).toBe("");
    }
    expect((await call(busiest, "", { "if-none-match": '"stale"' })).status).toBe(200);
  });

  it("gives each view its own tag", async () => {
    const tags = await Promise.all(["", "?points=1", "?family=vornel"].map(async (q) => (await call(busiest, q)).headers.get("etag")));
    expect(new Set(tags).size).toBe(3);
  });

  it("answers 304 from the stamp alone when the cache is cold", async () => {
    const etag = (await call(busiest)).headers.get("etag")!;
    invalidateBoardValues(null);
    const res = await call(busiest, "", { "if-none-match": etag });
    expect(res.status).toBe(304);
  });

  it("an approval, refreshGroups and invalidateBoardValues give new figures and a new tag at once", async () => {
    const s = db();
    const [pending] = await s.query<{ id: number; revisionId: number; familyId: number; label: string; family: string }>(
      `SELECT su.id, su.board_revision_id AS "revisionId", su.firmware_family_id AS "familyId", br.label, ff.slug AS family
         FROM submissions su JOIN board_revisions br ON br.id = su.board_revision_id
         JOIN board_models bm ON bm.id = br.board_model_id JOIN firmware_families ff ON ff.id = su.firmware_family_id
        WHERE bm.slug = $slug AND su.status = 'pending' AND su.voltage_scale IS NOT NULL ORDER BY su.id LIMIT 1`,
      { bind: { slug: busiest }, type: QueryTypes.SELECT },
    );
    expect(pending).toBeDefined();
    const query = `?revision=${encodeURIComponent(pending.label)}&family=${pending.family}`;
    const before = await call(busiest, query);
    const etag = before.headers.get("etag")!;
    const n = (await before.json()).revisions[0].families[0]?.voltageScale?.n ?? 0;

    const group = { boardRevisionId: pending.revisionId, firmwareFamilyId: pending.familyId };
    await s.transaction(async (transaction) => {
      await s.query("UPDATE submissions SET status = 'approved', updated_at = now() WHERE id = $id", { bind: { id: pending.id }, transaction });
      await refreshGroups(s, [group], transaction);
      transaction.afterCommit(() => invalidateBoardValues([group]));
    });

    const after = await call(busiest, query, { "if-none-match": etag });
    expect(after.status).toBe(200);
    expect(after.headers.get("etag")).not.toBe(etag);
    expect((await after.json()).revisions[0].families[0].voltageScale.n).toBe(n + 1);
  });
});
