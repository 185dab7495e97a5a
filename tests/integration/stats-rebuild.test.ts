import { QueryTypes } from "sequelize";
import { describe, expect, it } from "vitest";
import { getSequelize } from "@/lib/db/sequelize";
import { rebuildAllStats } from "@/lib/published/rebuild";
import { setupTestDatabase } from "@/tests/support/database";

setupTestDatabase("seeded");

const snapshot = () =>
  getSequelize().query(
    `SELECT board_revision_id, firmware_family_id, quantity, n, median, q1, q3, mad, ci_low, ci_high,
            outlier_count, recommended_value, confidence
       FROM board_stats ORDER BY 1, 2, 3`,
    { type: QueryTypes.SELECT },
  );

describe("npm run stats:rebuild (rebuildAllStats)", () => {
  it("recomputes every group from the approved submissions, matching what the seeder published", async () => {
    const seeded = await snapshot();
    expect(seeded.length).toBeGreaterThan(100);
    await getSequelize().query("DELETE FROM board_stats");
    const { rows } = await rebuildAllStats(getSequelize());
    expect(rows).toBe(seeded.length);
    expect(await snapshot()).toEqual(seeded);
  });

  it("leaves no row for a group without approved values, and finds the demo's planted outliers", async () => {
    const [orphans] = await getSequelize().query<{ k: number }>(
      `SELECT count(*) AS k FROM board_stats b WHERE NOT EXISTS (
         SELECT 1 FROM submissions s WHERE s.status = 'approved'
           AND s.board_revision_id = b.board_revision_id AND s.firmware_family_id = b.firmware_family_id)`,
      { type: QueryTypes.SELECT },
    );
    expect(orphans.k).toBe(0);
    const [flagged] = await getSequelize().query<{ k: number }>("SELECT coalesce(sum(outlier_count), 0) AS k FROM board_stats", {
      type: QueryTypes.SELECT,
    });
    expect(flagged.k).toBeGreaterThan(0);
  });
});
