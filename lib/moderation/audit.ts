import { QueryTypes, type Transaction } from "sequelize";
import { z } from "zod";
import { pageParam, pageSizeParam, parseQueryOrRefuse, wholeNumberParam } from "@/lib/http/query";
import { whereOf } from "@/lib/db/where";
import { AuditEvent, db } from "@/models";
import { ACTION_LABELS, AUDIT_ACTIONS, type AuditAction, type AuditEntityType, type Role, type SubmissionStatus } from "@/lib/vocabulary";

// The append-only log (migrations/20261210001100-create-audit-events.ts). Every moderation
// action writes exactly one event inside the transaction that makes the change, so the log and
// the data can never disagree: a rolled-back action leaves no event.

/** What a submission event records before and after: the fields a decision changes. */
export type SubmissionState = { status: SubmissionStatus; moderatorNote: string | null; version: number };
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
  /** The revert that undid this event, if any. */
  revertedByEventId: number | null;
  /** An admin may revert it: a submission decision (or revert) not yet reverted. Whether the submission has moved on since is checked when reverting. */
  revertable: boolean;
};

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
  revertedByEventId: number | null;
  at: Date;
};

// the revert lookup uses the UNIQUE index on reverts_event_id; names come by primary key
const EVENT_SELECT = `
  SELECT e.id, e.action, e.entity_type AS "entityType", e.submission_id AS "submissionId",
         e.target_user_id AS "targetUserId", tu.name AS "targetUserName", e.actor_id AS "actorId", au.name AS "actorName",
         e.before, e.after, e.reason, e.reverts_event_id AS "revertsEventId", rv.id AS "revertedByEventId", e.at
    FROM audit_events e
    LEFT JOIN users au ON au.id = e.actor_id
    LEFT JOIN users tu ON tu.id = e.target_user_id
    LEFT JOIN audit_events rv ON rv.reverts_event_id = e.id`;

function toView(r: EventRow): AuditEventView {
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
    revertedByEventId: r.revertedByEventId,
    revertable: r.entityType === "submission" && r.revertedByEventId === null,
  };
}

export async function getAuditEvent(id: number, transaction?: Transaction): Promise<AuditEventView | null> {
  const [row] = await db().query<EventRow>(`${EVENT_SELECT} WHERE e.id = :id`, { replacements: { id }, type: QueryTypes.SELECT, transaction });
  return row ? toView(row) : null;
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
 * the one changed). Each filter has its index (audit_events_action_idx, _submission_idx,
 * _actor_idx / _target_user_idx); unfiltered reads walk audit_events_at_idx.
 */
export async function listAuditEvents(query: Partial<AuditQuery> = {}): Promise<AuditPage> {
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
  return { events: rows.map(toView), page: q.page, pageSize: q.pageSize, total, pageCount: Math.max(1, Math.ceil(total / q.pageSize)) };
}
