import { describe, expect, it } from "vitest";
import { buildSyntheticCatalogue, familyDraws, revisionsOfBoard, syntheticUserCount } from "@/tests/benchmarks/synthetic-data";
import { DEMO_FIRMWARE_FAMILIES } from "@/seeders/demo/firmware-families";
import { BOARD_KINDS } from "@/lib/vocabulary";

// The benchmark's synthetic catalogue, at a tiny size. The patterns and lengths are the CHECK
// constraints of migrations/…-create-manufacturers.ts and …-create-board-models.ts, so a row that
// passes here is one PostgreSQL accepts.
const SLUG_CHECK = /^[a-z0-9]+(-[a-z0-9]+)*$/;
const MOUNTING_CHECK = /^[0-9]{1,2}(\.[0-9])?x[0-9]{1,2}(\.[0-9])?$/;

describe("synthetic catalogue", () => {
  const catalogue = buildSyntheticCatalogue(7);

  it("has the asked-for boards, 1 to 3 revisions each, and makers enough for them", () => {
    expect(catalogue.boards).toHaveLength(7);
    expect(catalogue.manufacturers).toHaveLength(1); // 40 boards per maker
    expect(buildSyntheticCatalogue(81).manufacturers).toHaveLength(3);
    // boards 0..6 get 1,2,3,1,2,3,1 revisions: 13 in all
    expect(catalogue.revisions).toHaveLength(13);
    expect([0, 1, 2, 3].map(revisionsOfBoard)).toEqual([1, 2, 3, 1]);
    const labels = catalogue.revisions.filter((r) => r.boardSlug === catalogue.boards[2].slug).map((r) => [r.label, r.position]);
    expect(labels).toEqual([
      ["v1", 0],
      ["v2", 1],
      ["v3", 2],
    ]);
  });

  it("passes the schema's CHECKs and unique keys", () => {
    const makerSlugs = new Set(catalogue.manufacturers.map((m) => m.slug));
    for (const m of catalogue.manufacturers) {
      expect(m.slug).toMatch(SLUG_CHECK);
      expect(m.name.length).toBeLessThanOrEqual(120);
    }
    for (const b of catalogue.boards) {
      expect(b.slug).toMatch(SLUG_CHECK);
      expect(b.slug.length).toBeLessThanOrEqual(120);
      expect(b.name.length).toBeLessThanOrEqual(160);
      expect(BOARD_KINDS).toContain(b.kind);
      expect(b.mountingPattern).toMatch(MOUNTING_CHECK);
      expect(b.minCells).toBeGreaterThanOrEqual(1);
      expect(b.minCells).toBeLessThanOrEqual(b.maxCells);
      expect(b.maxCells).toBeLessThanOrEqual(14);
      expect(makerSlugs.has(b.manufacturerSlug)).toBe(true);
    }
    expect(new Set(catalogue.boards.map((b) => b.slug)).size).toBe(7);
    expect(new Set(catalogue.revisions.map((r) => `${r.boardSlug}/${r.label}`)).size).toBe(13);
  });

  it("is the same every time", () => {
    expect(buildSyntheticCatalogue(7)).toEqual(catalogue);
  });

  it("gives each contributor about 40 submissions, within bounds", () => {
    expect(syntheticUserCount(100)).toBe(20);
    expect(syntheticUserCount(100_000)).toBe(2_500);
    expect(syntheticUserCount(1_000_000)).toBe(25_000);
  });

  it("splits [0, 1) among the demo families by their shares, with no gap or overlap", () => {
    const draws = familyDraws();
    expect(draws.map((d) => d.slug)).toEqual(DEMO_FIRMWARE_FAMILIES.map((f) => f.slug));
    expect(draws[0].lo).toBe(0);
    expect(draws[draws.length - 1].hi).toBe(1);
    for (let i = 1; i < draws.length; i++) expect(draws[i].lo).toBe(draws[i - 1].hi);
    // shares 0.5 / 0.3 / 0.2 (seeders/demo/firmware-families.ts)
    expect(draws.map((d) => d.hi - d.lo)).toEqual(DEMO_FIRMWARE_FAMILIES.map((f) => expect.closeTo(f.share, 12)));
  });
});
