import { QueryTypes, type Transaction } from "sequelize";
import { z } from "zod";
import { pageParam, pageSizeParam, parseQueryOrRefuse, wholeNumberParam } from "@/lib/http/query";
import { whereOf } from "@/lib/db/where";
import { AuditEvent, db } from "@/models";
import { ACTION_LABELS, AUDIT_ACTIONS, STATUSES, type AuditAction, type AuditEntityType, type Role, type SubmissionStatus } from "@/lib/vocabulary";

// The append-only log (migrations/20261210001100-create-audit-events.ts). Every moderation
// action writes exactly one event inside the transaction that makes the change, so the log and
// the data can never disagree: a rolled-back action leaves no event.

/** What a submission event records before and after: the fields a decision changes. */
export type SubmissionState = { status: SubmissionStatus; moderatorNote: string | null; version: number };
/** A submission event's recorded before/after as a SubmissionState; null when it does not record one. */
export function submissionState(value: Record<string, unknown>): SubmissionState | null {
  const { status, moderatorNote, version } = value as Partial<SubmissionState>;
  if (!STATUSES.includes(status as never) || typeof version !== "number" || (moderatorNote !== null && typeof moderatorNote !== "string")) return null;
  return { status: status!, moderatorNote: moderatorNote ?? null, version };
}

/** What a user event records: role and the admin's trust setting (null = by record). */
export type UserState = { role?: Role; trusted?: boolean | null };

export type NewEvent = {
  actorId: string | null;
  action: AuditAction;
  reason: string | null;
  revertsEventId?: number | null;
} & (
  | { entityType: "submission"; submissionId: number; before: SubmissionState; after: SubmissionState }
  | { entityType: "user"; targetUserId: string; before: UserState; after: UserState }
);

/** Appends one event inside `transaction` and returns its id. */
export async function writeAuditEvent(event: NewEvent, transaction: Transaction): Promise<{ id: number; at: Date }> {
  db();
  const row = await AuditEvent.create(
    {
      actorId: event.actorId,
      action: event.action,
      entityType: event.entityType,
      submissionId: event.entityType === "submission" ? event.submissionId : null,
      targetUserId: event.entityType === "user" ? event.targetUserId : null,
      before: event.before,
      after: event.after,
      reason: event.reason,
      revertsEventId: event.revertsEventId ?? null,
    },
    { transaction },
  );
  return { id: row.id, at: row.at };
}

export type AuditEventView = {
  id: number;
  action: AuditAction;
  actionLabel: string;
  at: string;
  /** Null for the system's own actions (auto-approval). */
  actor: { id: string; name: string } | null;
  entity: { type: "submission"; id: number } | { type: "user"; id: string; name: string };
  before: Record<string, unknown>;
  after: Record<string, unknown>;
  reason: string | null;
  /** The event this one undid (revert only). */
  revertsEventId: number | null;
  /** What the event this one undid was, when, for the page's plain words (revert only). */
  reverts: { id: number; action: AuditAction; actionLabel: string; at: string } | null;
  /** The revert that undid this event, if any. */
  revertedByEventId: number | null;
  /** Who undid this event and when, for the page's plain words. */
  revertedBy: { id: number; at: string; actor: { id: string; name: string } | null } | null;
  /**
   * Reverting it now would succeed (by the viewer, when one is given): exactly revertBlock() ===
   * null, the rule revertEvent() refuses by, so a listed-as-revertable event never answers 409.
   */
  revertable: boolean;
};

/**
 * Why an event cannot be reverted now, or null when it can: it is not a submission decision, it
 * was already reverted, it records no submission state, the submission has moved on since (its
 * version is no longer the one the event left), or the viewer is not an admin or is the
 * submission's contributor.
 */
export type RevertBlock = "not_admin" | "not_submission" | "already_reverted" | "no_state" | "moved_on" | "own_submission";

/** Who reads the log: `revertable` answers for them. Without one, it answers for an admin other than the contributor. */
export type Viewer = { id: string; role: Role };

type RevertFacts = {
  entityType: AuditEntityType;
  revertedByEventId: number | null;
  after: Record<string, unknown>;
  before: Record<string, unknown>;
  /** The submission's version and contributor now (null for a user event). */
  currentVersion: number | null;
  contributorId: string | null;
};

function revertBlock(e: RevertFacts, viewer?: Viewer | null): RevertBlock | null {
  if (viewer && viewer.role !== "admin") return "not_admin";
  if (e.entityType !== "submission") return "not_submission";
  if (e.revertedByEventId !== null) return "already_reverted";
  const after = submissionState(e.after);
  if (!after || !submissionState(e.before)) return "no_state";
  if (e.currentVersion !== after.version) return "moved_on";
  if (viewer && viewer.id === e.contributorId) return "own_submission";
  return null;
}

type EventRow = {
  id: number;
  action: AuditAction;
  entityType: AuditEntityType;
  submissionId: number | null;
  targetUserId: string | null;
  targetUserName: string | null;
  actorId: string | null;
  actorName: string | null;
  before: Record<string, unknown>;
  after: Record<string, unknown>;
  reason: string | null;
  revertsEventId: number | null;
  revertsAction: AuditAction | null;
  revertsAt: Date | null;
  revertedByEventId: number | null;
  revertedAt: Date | null;
  revertedById: string | null;
  revertedByName: string | null;
  currentVersion: number | null;
  contributorId: string | null;
  at: Date;
};

// the revert lookup uses the UNIQUE index on reverts_event_id; names, the undone event and the
// submission's current version come by primary key
const EVENT_SELECT = `
  SELECT e.id, e.action, e.entity_type AS "entityType", e.submission_id AS "submissionId",
         e.target_user_id AS "targetUserId", tu.name AS "targetUserName", e.actor_id AS "actorId", au.name AS "actorName",
         e.before, e.after, e.reason, e.reverts_event_id AS "revertsEventId", ov.action AS "revertsAction", ov.at AS "revertsAt",
         rv.id AS "revertedByEventId", rv.at AS "revertedAt", rv.actor_id AS "revertedById", rvu.name AS "revertedByName",
         s.version AS "currentVersion", s.contributor_id AS "contributorId", e.at
    FROM audit_events e
    LEFT JOIN users au ON au.id = e.actor_id
    LEFT JOIN users tu ON tu.id = e.target_user_id
    LEFT JOIN audit_events ov ON ov.id = e.reverts_event_id
    LEFT JOIN audit_events rv ON rv.reverts_event_id = e.id
    LEFT JOIN users rvu ON rvu.id = rv.actor_id
    LEFT JOIN submissions s ON s.id = e.submission_id`;

const iso = (d: Date) => new Date(d).toISOString();

function toView(r: EventRow, viewer?: Viewer | null): AuditEventView {
  return {
    id: r.id,
    action: r.action,
    actionLabel: ACTION_LABELS[r.action],
    at: new Date(r.at).toISOString(),
    actor: r.actorId ? { id: r.actorId, name: r.actorName ?? "" } : null,
    entity: r.entityType === "submission" ? { type: "submission", id: r.submissionId! } : { type: "user", id: r.targetUserId!, name: r.targetUserName ?? "" },
    before: r.before,
    after: r.after,
    reason: r.reason,
    revertsEventId: r.revertsEventId,
    reverts:
      r.revertsEventId !== null && r.revertsAction && r.revertsAt
        ? { id: r.revertsEventId, action: r.revertsAction, actionLabel: ACTION_LABELS[r.revertsAction], at: iso(r.revertsAt) }
        : null,
    revertedByEventId: r.revertedByEventId,
    revertedBy:
      r.revertedByEventId !== null && r.revertedAt
        ? { id: r.revertedByEventId, at: iso(r.revertedAt), actor: r.revertedById ? { id: r.revertedById, name: r.revertedByName ?? "" } : null }
        : null,
    revertable: revertBlock(r, viewer) === null,
  };
}

async function eventRow(id: number, transaction?: Transaction): Promise<EventRow | null> {
  const [row] = await db().query<EventRow>(`${EVENT_SELECT} WHERE e.id = :id`, { replacements: { id }, type: QueryTypes.SELECT, transaction });
  return row ?? null;
}

export async function getAuditEvent(id: number, transaction?: Transaction): Promise<AuditEventView | null> {
  const row = await eventRow(id, transaction);
  return row ? toView(row) : null;
}

/** One event as `viewer` would see it listed, with the reason they cannot revert it now (null: they can). */
export async function eventForRevert(id: number, viewer: Viewer): Promise<{ event: AuditEventView; block: RevertBlock | null } | null> {
  const row = await eventRow(id);
  return row ? { event: toView(row, viewer), block: revertBlock(row, viewer) } : null;
}

const AUDIT_MAX_PAGE_SIZE = 100;

const AuditQuerySchema = z.object({
  page: pageParam(),
  pageSize: pageSizeParam(AUDIT_MAX_PAGE_SIZE, 50),
  action: z.enum(AUDIT_ACTIONS, { error: `action is one of: ${AUDIT_ACTIONS.join(", ")}` }).optional(),
  submission: wholeNumberParam("submission is a submission id", 1, 2_147_483_647).optional(),
  user: z.uuid("user is a user id (a UUID)").optional(),
});
export type AuditQuery = z.output<typeof AuditQuerySchema>;

export function parseAuditQuery(input: Record<string, string | string[] | undefined>): AuditQuery {
  return parseQueryOrRefuse(AuditQuerySchema, input);
}

export type AuditPage = { events: AuditEventView[]; page: number; pageSize: number; total: number; pageCount: number };

/**
 * The log, newest first, optionally for one action, one submission, or one user (as actor or as
 * the one changed); `revertable` answers for `viewer` when given. Each filter has its index (audit_events_action_idx, _submission_idx,
 * _actor_idx / _target_user_idx); unfiltered reads walk audit_events_at_idx.
 */
export async function listAuditEvents(query: Partial<AuditQuery> = {}, viewer?: Viewer | null): Promise<AuditPage> {
  const q = AuditQuerySchema.parse(query);
  const replacements: Record<string, unknown> = { limit: q.pageSize, offset: (q.page - 1) * q.pageSize };
  const whereSql = whereOf(
    [
      ["e.action = :action", "action", q.action],
      ["e.submission_id = :submission", "submission", q.submission],
      ["(e.actor_id = :user OR e.target_user_id = :user)", "user", q.user],
    ],
    replacements,
  );
  const sequelize = db();
  const [rows, [{ total }]] = await Promise.all([
    sequelize.query<EventRow>(`${EVENT_SELECT} ${whereSql} ORDER BY e.at DESC, e.id DESC LIMIT :limit OFFSET :offset`, {
      replacements,
      type: QueryTypes.SELECT,
    }),
    sequelize.query<{ total: number }>(`SELECT count(*)::int AS total FROM audit_events e ${whereSql}`, { replacements, type: QueryTypes.SELECT }),
  ]);
  return { events: rows.map((r) => toView(r, viewer)), page: q.page, pageSize: q.pageSize, total, pageCount: Math.max(1, Math.ceil(total / q.pageSize)) };
}
