import { QueryTypes } from "sequelize";
import { afterAll, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS } from "@/seeders/demo/accounts";
import { listPacks } from "@/lib/garage/packs";
import { listQuads } from "@/lib/garage/quads";
import { getWorksheet } from "@/lib/worksheets";
import { stopBoss } from "@/lib/jobs";
import { listAuditEvents, revertEvent } from "@/lib/moderation";
import { getValueHistory } from "@/lib/published/history";
import { db } from "@/models";
import { setupTestDatabase } from "@/tests/support/database";

// What the demo seeder (seeders/20261202000100-demo-scenario.ts) leaves in PostgreSQL beyond the
// catalogue: evidence rows behind the measured submissions, one approval event per approved
// submission, and a value history whose newest row per series is what board_stats publishes.
// A seeded approval can be reverted by an admin like a live one.
setupTestDatabase("seeded");
afterAll(() => stopBoss());

const select = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) => db().query<T>(sql, { type: QueryTypes.SELECT, replacements });

describe("the seeded demo", () => {
  it("was inserted by the one seeder file; the scenario's modules in seeders/demo/ are not seeders", async () => {
    // lib/db/migrate.ts globs seeders/*.{ts,js} without descending into folders (and sequelize-cli reads
    // only the top level of its seeders-path too, from memory), so seeders/demo/*.ts are never run
    const rows = await select<{ name: string }>(`SELECT name FROM "SequelizeData" ORDER BY name`);
    expect(rows.map((r) => r.name)).toEqual(["20261202000100-demo-scenario.ts"]);
  });

  it("has evidence rows for every measured submission and none for the unverified, with a few mismatches flagged", async () => {
    const rows = await select<{ method: string; n: number; without: number; mismatched: number; summarised: number }>(`
      SELECT s.method, count(*)::int AS n,
             count(*) FILTER (WHERE NOT EXISTS (SELECT 1 FROM submission_voltage_readings v WHERE v.submission_id = s.id)
                                AND NOT EXISTS (SELECT 1 FROM submission_cycles c WHERE c.submission_id = s.id)
                                AND NOT EXISTS (SELECT 1 FROM submission_bench_points b WHERE b.submission_id = s.id))::int AS without,
             count(*) FILTER (WHERE s.evidence_mismatch)::int AS mismatched,
             count(*) FILTER (WHERE s.evidence_summary IS NOT NULL)::int AS summarised
        FROM submissions s GROUP BY s.method ORDER BY s.method`);
    const by = Object.fromEntries(rows.map((r) => [r.method, r]));
    expect(by.unverified).toMatchObject({ without: by.unverified.n, mismatched: 0, summarised: 0 });
    for (const m of ["multimeter", "fly_recharge", "bench_clamp"]) expect(by[m]).toMatchObject({ without: 0, summarised: by[m].n });
    const mismatched = rows.reduce((a, r) => a + r.mismatched, 0);
    expect(mismatched).toBeGreaterThan(10);
    const [{ pending }] = await select<{ pending: number }>("SELECT count(*)::int AS pending FROM submissions WHERE status = 'pending' AND evidence_mismatch");
    expect(pending).toBeGreaterThan(0);
  });

  it("has one approval event per approved submission, by the demo moderator (or another for the moderator's own)", async () => {
    const [row] = await select<{ approved: number; events: number; own: number; moderatorEvents: number }>(
      `
      SELECT (SELECT count(*)::int FROM submissions WHERE status = 'approved') AS approved,
             (SELECT count(*)::int FROM audit_events WHERE action = 'approve') AS events,
             (SELECT count(*)::int FROM audit_events e JOIN submissions s ON s.id = e.submission_id WHERE e.actor_id = s.contributor_id) AS own,
             (SELECT count(*)::int FROM audit_events e JOIN users u ON u.id = e.actor_id WHERE lower(u.email) = :email) AS "moderatorEvents"`,
      { email: DEMO_ACCOUNTS.moderator.email },
    );
    expect(row.events).toBe(row.approved);
    expect(row.own).toBe(0);
    expect(row.moderatorEvents).toBeGreaterThan(row.approved - 10);
  });

  it("for every group and quantity the newest history row equals board_stats; timestamps non-decreasing and in the window", async () => {
    const differing = await select(`
      WITH newest AS (
        SELECT DISTINCT ON (board_revision_id, firmware_family_id, quantity) *
          FROM published_value_history ORDER BY board_revision_id, firmware_family_id, quantity, id DESC)
      SELECT b.board_revision_id, b.firmware_family_id, b.quantity
        FROM board_stats b FULL JOIN newest h USING (board_revision_id, firmware_family_id, quantity)
       WHERE h.id IS NULL OR b.n IS NULL OR h.recommended_value IS DISTINCT FROM b.recommended_value OR h.n IS DISTINCT FROM b.n
          OR h.ci_low IS DISTINCT FROM b.ci_low OR h.ci_high IS DISTINCT FROM b.ci_high OR h.confidence IS DISTINCT FROM b.confidence`);
    expect(differing).toEqual([]);
    const [order] = await select<{ backwards: number; outside: number; total: number }>(`
      SELECT count(*) FILTER (WHERE at < prev)::int AS backwards,
             count(*) FILTER (WHERE at > now() OR at < now() - interval '20 months')::int AS outside,
             count(*)::int AS total
        FROM (SELECT at, lag(at) OVER (PARTITION BY board_revision_id, firmware_family_id, quantity ORDER BY id) AS prev FROM published_value_history) h`);
    expect(order).toMatchObject({ backwards: 0, outside: 0 });
    expect(order.total).toBeGreaterThan(1000);
    const [{ unsourced }] = await select<{ unsourced: number }>(
      "SELECT count(*)::int AS unsourced FROM published_value_history WHERE caused_by_event_id IS NULL",
    );
    expect(unsourced).toBe(0);
  });

  it("the board page's timeline is no longer empty", async () => {
    const history = await getValueHistory("brackenwell-f7-mini");
    expect(history!.series.length).toBeGreaterThan(0);
    expect(Math.max(...history!.series.map((s) => s.points.length))).toBeGreaterThan(5);
  });

  it("an admin can revert a seeded approval: the submission goes back to pending and the figures move", async () => {
    const [admin] = await select<{ id: string }>("SELECT id FROM users WHERE lower(email) = :email", { email: DEMO_ACCOUNTS.admin.email });
    const [target] = await select<{ id: number; eventId: number; r: number; f: number }>(`
      SELECT s.id, e.id AS "eventId", s.board_revision_id AS r, s.firmware_family_id AS f
        FROM audit_events e JOIN submissions s ON s.id = e.submission_id
       WHERE e.action = 'approve' AND s.current_scale IS NOT NULL ORDER BY e.at DESC LIMIT 1`);
    const listed = await listAuditEvents({ submission: target.id });
    expect(listed.events[0]).toMatchObject({
      id: target.eventId,
      revertable: true,
      before: { status: "pending", version: 0 },
      after: { status: "approved", version: 1 },
    });

    const result = await revertEvent({ id: admin.id }, target.eventId, { reason: "Approved by mistake during the demo walkthrough." });
    expect(result.submission).toMatchObject({ id: target.id, status: "pending", version: 2 });
    expect(result.changed.length).toBeGreaterThan(0);
    const [newest] = await select<{ caused: number; n: number }>(
      `SELECT caused_by_event_id AS caused, n FROM published_value_history
        WHERE board_revision_id = :r AND firmware_family_id = :f AND quantity = 'current_scale' ORDER BY id DESC LIMIT 1`,
      { r: target.r, f: target.f },
    );
    const [stats] = await select<{ n: number }>(
      "SELECT n FROM board_stats WHERE board_revision_id = :r AND firmware_family_id = :f AND quantity = 'current_scale'",
      { r: target.r, f: target.f },
    );
    expect(newest.caused).toBe(result.event.id);
    expect(newest.n).toBe(stats?.n ?? 0);
  });

  it("the demo contributor's garage is at work: two quads, three packs with logs, a worksheet of each kind in progress and one published", async () => {
    const [owner] = await select<{ id: string }>("SELECT id FROM users WHERE lower(email) = :email", { email: DEMO_ACCOUNTS.contributor.email });
    const quads = await listQuads(owner.id);
    const packs = await listPacks(owner.id);
    expect(quads).toHaveLength(2);
    expect(packs).toHaveLength(3);
    for (const p of packs) {
      expect(p.charges.length).toBeGreaterThanOrEqual(3);
      // the seeded logs obey the live rules: no charge before the purchase, none in the future, none above 150 % of rated
      for (const c of p.charges) {
        expect(c.chargedOn >= p.purchasedOn!).toBe(true);
        expect(c.chargedOn <= new Date().toISOString().slice(0, 10)).toBe(true);
        expect(c.chargedMah).toBeLessThanOrEqual(1.5 * p.ratedMah);
      }
      expect(p.landing).not.toBeNull();
    }
    const sheets = await select<{
      id: number;
      kind: string;
      submissionId: number | null;
      packId: number | null;
      status: string | null;
      contributor: string | null;
    }>(
      `SELECT w.id, w.kind, w.submission_id AS "submissionId", w.pack_id AS "packId", s.status, s.contributor_id AS contributor
         FROM worksheets w LEFT JOIN submissions s ON s.id = w.submission_id WHERE w.owner_id = :owner ORDER BY w.id`,
      { owner: owner.id },
    );
    const inProgress = sheets.filter((w) => w.submissionId == null);
    expect(inProgress.map((w) => w.kind).sort()).toEqual(["bench", "fly_recharge", "voltage"]);
    const published = sheets.filter((w) => w.submissionId != null);
    expect(published).toHaveLength(1);
    expect(published[0]).toMatchObject({ status: "approved", contributor: owner.id });
    // every worksheet reads back through the live code, with its entries
    for (const w of sheets) {
      const view = (await getWorksheet(owner.id, w.id)) as unknown as Record<string, unknown[]>;
      const entries = view.steps ?? view.readings ?? view.points;
      expect(entries.length).toBeGreaterThan(0);
    }
  });
});
