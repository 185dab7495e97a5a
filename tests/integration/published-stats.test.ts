import fc from "fast-check";
import { QueryTypes } from "sequelize";
import { describe, expect, it } from "vitest";
import { computeAggregates, refreshGroups } from "@/lib/published/refresh";
import { describeFlags, summarise } from "@/lib/stats";
import { getSequelize } from "@/lib/db/sequelize";
import { useTestDatabase } from "@/tests/support/database";
import { insertFixture, insertSubmissions, type Fixture } from "@/tests/support/fixtures";

useTestDatabase("migrated");

const close = (a: number | null, b: number | null) => {
  if (a === null || b === null) return expect(a).toBe(b);
  expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(b)));
};

async function freshGroup(fx: Fixture, values: number[]) {
  const s = getSequelize();
  await s.query("DELETE FROM board_stats; DELETE FROM submissions");
  await insertSubmissions(
    s,
    fx,
    fx.revisionIds[0],
    values.map((v) => ({ currentOffset: v })),
  );
  const rows = await computeAggregates(s, [{ boardRevisionId: fx.revisionIds[0], firmwareFamilyId: fx.familyId }]);
  return rows.find((r) => r.quantity === "current_offset")!;
}

describe("board_stats: PostgreSQL aggregates agree with the TypeScript definitions (lib/stats)", () => {
  let fx: Fixture;

  it("on generated data, to 1e-9 (PostgreSQL percentile_cont vs type-7 quantileType7; MAD; order-statistic CI; flags)", async () => {
    fx = await insertFixture(getSequelize(), { revisions: 2 });
    await fc.assert(
      fc.asyncProperty(
        // Settings as a firmware takes them: at most three decimals within the stored range, with
        // ties made likely by the second arbitrary. (Subnormal doubles are not settings, and
        // PostgreSQL raises an error on float underflow where JavaScript quietly yields 0.)
        fc.array(
          fc.oneof(
            fc.integer({ min: -999_000_000, max: 999_000_000 }).map((i) => i / 1000),
            fc.integer({ min: 95, max: 105 }),
          ),
          { minLength: 1, maxLength: 60 },
        ),
        async (values) => {
          const sql = await freshGroup(fx, values);
          const ts = summarise(values);
          const flags = describeFlags(values);
          expect(sql.n).toBe(ts.n);
          for (const key of ["median", "q1", "q3", "iqr", "mad", "scaledMad", "ciLow", "ciHigh", "ciCoverage"] as const) close(sql[key], ts[key]);
          expect(sql.zScaleRule).toBe(flags.zScaleRule);
          expect(sql.outlierCount).toBe(flags.points.filter((p) => p.outlier).length);
          expect(sql.tukeyCount).toBe(flags.points.filter((p) => p.tukey !== "none").length);
        },
      ),
      { numRuns: 40 },
    );
  });

  it("the check-value set [10.9, 11, 11, 11.1, 11.2, 25] (type 7 quartiles, Hyndman & Fan 1996; modified z, NIST e-Handbook §1.3.5.17): 25 is the one outlier", async () => {
    const sql = await freshGroup(fx, [10.9, 11, 11, 11.1, 11.2, 25]);
    close(sql.median, 11.05);
    close(sql.q1, 11);
    close(sql.q3, 11.175);
    close(sql.mad, 0.1);
    expect(sql.outlierCount).toBe(1);
    expect(sql.tukeyCount).toBe(1);
  });

  it("MAD = 0 ([11, 11, 11, 11, 12]) uses the mean-absolute-deviation rule of lib/stats, never a division by zero", async () => {
    const sql = await freshGroup(fx, [11, 11, 11, 11, 12]);
    expect(sql.mad).toBe(0);
    expect(sql.zScaleRule).toBe("mean_abs_dev");
    expect(sql.outlierCount).toBe(describeFlags([11, 11, 11, 11, 12]).points.filter((p) => p.outlier).length);
  });

  it("fewer than 3 values: no flags; fewer than 6: no CI", async () => {
    const two = await freshGroup(fx, [100, 1000]);
    expect([two.zScaleRule, two.outlierCount, two.tukeyCount]).toEqual(["too_few", 0, 0]);
    const five = await freshGroup(fx, [1, 2, 3, 4, 5]);
    expect([five.ciLow, five.ciHigh]).toEqual([null, null]);
  });
});

describe("refreshGroups", () => {
  it("counts only approved values, keeps families and revisions apart, and writes one row per quantity", async () => {
    const s = getSequelize();
    await s.query("DELETE FROM board_stats; DELETE FROM submissions");
    const fx = (await s.query<{ id: number }>("SELECT id FROM firmware_families", { type: QueryTypes.SELECT }))[0];
    const [rev1, rev2] = (await s.query<{ id: number }>("SELECT id FROM board_revisions ORDER BY position", { type: QueryTypes.SELECT })).map((r) => r.id);
    const user = (await s.query<{ id: string }>("SELECT id FROM users", { type: QueryTypes.SELECT }))[0];
    const fixture = { familyId: fx.id, revisionIds: [rev1, rev2], userId: user.id, boardId: 0 };
    await insertSubmissions(s, fixture, rev1, [
      { voltageScale: 110, currentScale: 250, currentOffset: 0 },
      { voltageScale: 111, currentScale: 252 },
      { voltageScale: 109, currentScale: 249, currentOffset: 2 },
      { voltageScale: 500, status: "pending" },
      { voltageScale: 900, status: "rejected" },
    ]);
    await insertSubmissions(s, fixture, rev2, [{ voltageScale: 120 }]);
    const rows = await refreshGroups(s, [
      { boardRevisionId: rev1, firmwareFamilyId: fx.id },
      { boardRevisionId: rev2, firmwareFamilyId: fx.id },
    ]);
    const stored = await s.query<{ board_revision_id: number; quantity: string; n: number; median: number; recommended_value: number }>(
      "SELECT board_revision_id, quantity, n, median, recommended_value FROM board_stats ORDER BY board_revision_id, quantity",
      { type: QueryTypes.SELECT },
    );
    expect(rows).toHaveLength(4);
    expect(stored).toEqual([
      { board_revision_id: rev1, quantity: "current_offset", n: 2, median: 1, recommended_value: 1 },
      { board_revision_id: rev1, quantity: "current_scale", n: 3, median: 250, recommended_value: 250 },
      { board_revision_id: rev1, quantity: "voltage_scale", n: 3, median: 110, recommended_value: 110 },
      { board_revision_id: rev2, quantity: "voltage_scale", n: 1, median: 120, recommended_value: 120 },
    ]);
  });

  it("a rolled-back transaction leaves the published figures as they were", async () => {
    const s = getSequelize();
    const before = await s.query("SELECT * FROM board_stats ORDER BY 1, 2, 3", { type: QueryTypes.SELECT });
    await expect(
      s.transaction(async (t) => {
        await s.query("UPDATE submissions SET status = 'rejected' WHERE status = 'approved'", { transaction: t });
        await refreshGroups(s, null, t);
        throw new Error("abort");
      }),
    ).rejects.toThrow("abort");
    expect(await s.query("SELECT * FROM board_stats ORDER BY 1, 2, 3", { type: QueryTypes.SELECT })).toEqual(before);
  });
});
