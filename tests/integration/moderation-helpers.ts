import { QueryTypes, type Transaction } from "sequelize";
import { POST as approveRoute } from "@/app/api/v1/moderation/submissions/[id]/approve/route";
import { POST as rejectRoute } from "@/app/api/v1/moderation/submissions/[id]/reject/route";
import { POST as requestChangesRoute } from "@/app/api/v1/moderation/submissions/[id]/request-changes/route";
import { computeAggregates, derivePublished } from "@/lib/published/refresh";
import type { GroupKey } from "@/lib/published/group-key";
import type { Decision } from "@/lib/vocabulary";
import { db } from "@/models";
import { callRoute, withCookie } from "@/tests/support/auth";
import { insertFixture, type Fixture } from "@/tests/support/fixtures";

// Shared by the moderation-*.test.ts files: a board group of our own on a migrated database (so
// every figure is known), pending submissions in it, the decision routes called in process, and
// the row counts a refused action must leave unchanged.

export type Setup = { fx: Fixture; group: GroupKey };

/** The fixture board (one revision, one family) with `approved` current scale settings. */
export async function setupGroup(approved: number[]): Promise<Setup> {
  const fx = await insertFixture(db());
  const group = { boardRevisionId: fx.revisionIds[0], firmwareFamilyId: fx.familyId };
  for (const v of approved) await insertSubmission(fx, { currentScale: v, status: "approved" });
  const { refreshGroups } = await import("@/lib/published/refresh");
  await refreshGroups(db(), [group]);
  return { fx, group };
}

export type NewSubmission = {
  currentScale?: number | null;
  voltageScale?: number | null;
  status?: "pending" | "approved" | "rejected" | "changes_requested";
  contributorId?: string;
  mismatch?: boolean;
  method?: string;
  /** How long ago it was sent, in hours. */
  ageHours?: number;
};

/** One submission in the fixture group; returns its id. */
export async function insertSubmission(fx: Fixture, s: NewSubmission = {}, transaction?: Transaction): Promise<number> {
  const [row] = await db().query<{ id: number }>(
    `INSERT INTO submissions (board_revision_id, firmware_family_id, firmware_version, contributor_id, sensing_source, method,
        voltage_scale, current_scale, status, evidence_mismatch, evidence_summary, created_at, updated_at)
     VALUES (:r, :f, '1.0.0', :c, 'board_adc', :method, :vs, :cs, :status, :mismatch, CASE WHEN :mismatch THEN '{}'::jsonb END,
             now() - make_interval(hours => :age), now() - make_interval(hours => :age))
     RETURNING id`,
    {
      replacements: {
        r: fx.revisionIds[0],
        f: fx.familyId,
        c: s.contributorId ?? fx.userId,
        method: s.method ?? "fly_recharge",
        vs: s.voltageScale ?? null,
        cs: s.currentScale === undefined ? 400 : s.currentScale,
        status: s.status ?? "pending",
        mismatch: s.mismatch ?? false,
        age: s.ageHours ?? 1,
      },
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return row.id;
}

/** A second contributor (no approved submission: a first-timer). */
export async function insertPerson(email: string, name = "Second Person"): Promise<string> {
  const [row] = await db().query<{ id: string }>("INSERT INTO users (name, email) VALUES (:name, :email) RETURNING id", {
    replacements: { name, email },
    type: QueryTypes.SELECT,
  });
  return row.id;
}

const ROUTES = { approve: approveRoute, reject: rejectRoute, request_changes: requestChangesRoute } as const;
const SEGMENT: Record<Decision, string> = { approve: "approve", reject: "reject", request_changes: "request-changes" };

/** POST /api/v1/moderation/submissions/{id}/<decision> in process. */
export function decideAs(decision: Decision, id: number | string, body: unknown, cookie: string): Promise<Response> {
  const request = new Request(`http://test.local/api/v1/moderation/submissions/${id}/${SEGMENT[decision]}`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
  });
  return callRoute(ROUTES[decision], withCookie(request, cookie), { params: Promise.resolve({ id: String(id) }) });
}

export async function submissionRow(id: number) {
  const [row] = await db().query<{ status: string; version: number; moderatorNote: string | null }>(
    `SELECT status, version, moderator_note AS "moderatorNote" FROM submissions WHERE id = :id`,
    { replacements: { id }, type: QueryTypes.SELECT },
  );
  return row;
}

/** Everything a moderation action writes, as counts and fingerprints: equal before and after means nothing was written. */
export async function writtenState(): Promise<Record<string, unknown>> {
  const [row] = await db().query<Record<string, unknown>>(
    `SELECT (SELECT count(*)::int FROM audit_events) AS events,
            (SELECT count(*)::int FROM published_value_history) AS history,
            (SELECT coalesce(sum(version), 0)::int FROM submissions) AS versions,
            (SELECT string_agg(id || ':' || status || ':' || coalesce(moderator_note, ''), ',' ORDER BY id) FROM submissions) AS statuses,
            (SELECT count(*)::int FROM board_stats) AS stats,
            (SELECT max(computed_at)::text FROM board_stats) AS computed,
            (SELECT count(*)::int FROM pgboss.job WHERE name = 'mail.send') AS mails,
            (SELECT string_agg(id || ':' || role || ':' || coalesce(trusted::text, '-'), ',' ORDER BY id) FROM users) AS users`,
    { type: QueryTypes.SELECT },
  );
  return row;
}

const FIGURES = ["quantity", "n", "median", "q1", "q3", "mad", "ciLow", "ciHigh", "outlierCount", "tukeyCount", "recommendedValue", "confidence"] as const;

/** The group's board_stats rows as stored (the figures, not the timestamps). */
export async function storedStats(group: GroupKey) {
  const rows = await db().query<Record<string, unknown>>(
    `SELECT quantity, n, median, q1, q3, mad, ci_low AS "ciLow", ci_high AS "ciHigh", outlier_count AS "outlierCount",
            tukey_count AS "tukeyCount", recommended_value AS "recommendedValue", confidence
       FROM board_stats WHERE board_revision_id = :r AND firmware_family_id = :f ORDER BY quantity`,
    { replacements: { r: group.boardRevisionId, f: group.firmwareFamilyId }, type: QueryTypes.SELECT },
  );
  return rows;
}

/** What a fresh rebuild of the group would store, computed without writing. */
export async function rebuiltStats(group: GroupKey) {
  const rows = (await computeAggregates(db(), [group])).map(derivePublished).sort((a, b) => a.quantity.localeCompare(b.quantity));
  return rows.map((r) => Object.fromEntries(FIGURES.map((k) => [k, r[k]])));
}

export async function historyRows(group: GroupKey) {
  return db().query<{ quantity: string; recommendedValue: number | null; n: number; ciLow: number | null; ciHigh: number | null; eventId: number | null }>(
    `SELECT quantity, recommended_value AS "recommendedValue", n, ci_low AS "ciLow", ci_high AS "ciHigh", caused_by_event_id AS "eventId"
       FROM published_value_history WHERE board_revision_id = :r AND firmware_family_id = :f ORDER BY id`,
    { replacements: { r: group.boardRevisionId, f: group.firmwareFamilyId }, type: QueryTypes.SELECT },
  );
}

/** The mail jobs queued for an address, oldest first. */
export async function queuedMails(email: string): Promise<{ to: string; subject: string; text: string }[]> {
  const rows = await db().query<{ data: { to: string; subject: string; text: string } }>(
    `SELECT data FROM pgboss.job WHERE name = 'mail.send' AND data->>'to' = :email ORDER BY created_on`,
    { replacements: { email }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.data);
}

/** The one error shape (shared with the submission tests). */
export { expectError } from "./submissions-helpers";
