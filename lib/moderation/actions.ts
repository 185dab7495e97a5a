import { QueryTypes } from "sequelize";
import type { z } from "zod";
import { ApiError, badRequest } from "@/lib/http/errors";
import type { QuantityKey } from "@/lib/published/board-values-types";
import { db } from "@/models";
import { type Decision, type Method, QUEUE_FLAG_LABELS, type SubmissionStatus } from "@/lib/vocabulary";
import { getAuditEvent, type AuditEventView } from "./audit";
import { flagsOfRow, scoredSubmission, type SubmissionFlags } from "./flags";
import { fieldErrorsOf } from "@/lib/http/field-errors";
import { ApproveBodySchema, BulkApproveBodySchema, FlaggedApproveBodySchema, RejectBodySchema, RequestChangesBodySchema } from "./schemas";
import { applyTransition, ModerationRefusal, type TransitionInput } from "./transition";

// A moderator's decisions on a pending submission: approve, reject (with a reason), request
// changes (with a message). Each is one transaction (transition.ts); bodies are checked before it
// starts, so a refused request writes nothing. Who may call is the route's guard
// (role("moderator"); an admin passes too); these functions take the actor's id.

/** A decision may be made on a submission that waits: pending, or sent back for changes and not yet edited. */
const UNDECIDED: readonly SubmissionStatus[] = ["pending", "changes_requested"];

export type Actor = { id: string };

export type DecisionResult = {
  submission: { id: number; status: SubmissionStatus; version: number; moderatorNote: string | null };
  event: AuditEventView;
  /** Published quantities whose recommended value, n or interval moved (approvals only). */
  changed: QuantityKey[];
};

function parse<S extends z.ZodType>(schema: S, body: unknown): z.output<S> {
  const parsed = schema.safeParse(body ?? {});
  if (!parsed.success) throw badRequest(fieldErrorsOf(parsed.error.issues));
  return parsed.data;
}

type DecisionPlan = Pick<TransitionInput, "expectedVersion" | "to" | "reason" | "action" | "check">;

/** Approving a value far from the others, or one its own evidence disagrees with, needs a reason (FlaggedApproveBodySchema). */
export const approvalNeedsReason = (flags: Pick<SubmissionFlags, "outlier" | "mismatch">) => flags.outlier || flags.mismatch;

function plan(decision: Decision, body: unknown): DecisionPlan {
  switch (decision) {
    case "approve": {
      const b = parse(ApproveBodySchema, body);
      return {
        action: "approve",
        expectedVersion: b.version,
        to: { status: "approved", moderatorNote: b.note ?? null },
        reason: b.reason ?? b.note ?? null,
        // on the locked row, so the flags judged are the ones the approval meets
        check: async (row, transaction) => {
          const scored = await scoredSubmission(row.id, transaction);
          if (scored && approvalNeedsReason(flagsOfRow(scored))) parse(FlaggedApproveBodySchema, body);
        },
      };
    }
    case "reject": {
      const b = parse(RejectBodySchema, body);
      // the reason is the contributor's feedback as well as the log's
      return { action: "reject", expectedVersion: b.version, to: { status: "rejected", moderatorNote: b.reason }, reason: b.reason };
    }
    case "request_changes": {
      const b = parse(RequestChangesBodySchema, body);
      return { action: "request_changes", expectedVersion: b.version, to: { status: "changes_requested", moderatorNote: b.message }, reason: b.message };
    }
  }
}

/**
 * One decision on one submission. `body` is the request's JSON: { version, note?, reason? } to
 * approve (reason required when a value is far off or the evidence disagrees),
 * { version, reason } to reject, { version, message } to request changes. Throws ApiError: 400
 * naming the field, 404 unknown id, 403 own submission, 409 "Someone else acted on this first"
 * for a stale version, 409 when the submission is no longer undecided.
 */
export async function decide(actor: Actor, submissionId: number, decision: Decision, body: unknown): Promise<DecisionResult> {
  const p = plan(decision, body);
  const sequelize = db();
  const result = await sequelize.transaction((transaction) => applyTransition({ ...p, submissionId, allowedFrom: UNDECIDED, actorId: actor.id }, transaction));
  const event = (await getAuditEvent(result.eventId))!;
  return {
    submission: { id: submissionId, status: result.after.status, version: result.after.version, moderatorNote: result.after.moderatorNote },
    event,
    changed: result.changed,
  };
}

export const approveSubmission = (actor: Actor, id: number, body: { version: number; note?: string | null; reason?: string | null }) =>
  decide(actor, id, "approve", body);

type BulkItemResult =
  | { id: number; outcome: "approved"; version: number; eventId: number; changed: QuantityKey[] }
  | { id: number; outcome: "conflict" | "refused"; status: number; message: string };

export type BulkResult = {
  results: BulkItemResult[];
  approved: number[];
  /** Someone else acted on these first (stale version). */
  conflicted: number[];
  /** Flagged, unknown, your own, or no longer pending. */
  refused: number[];
};

/**
 * Approves several unflagged pending submissions, each in its own transaction with its own
 * version check, in the order given. An item that is flagged (far off, evidence disagrees,
 * first-time contributor) is refused: those need a look of their own. Never throws for one item;
 * a bad body, or a batch mixing unverified values with measured ones, is a 400 before anything is
 * written.
 */
export async function bulkApprove(actor: Actor, body: unknown): Promise<BulkResult> {
  const { items } = parse(BulkApproveBodySchema, body);
  const sequelize = db();
  // values nobody measured are never approved in one batch with measured ones: a quick "approve all"
  // must not give a guess the weight of a meter reading without the moderator choosing that batch
  const methods = await sequelize.query<{ method: Method }>("SELECT DISTINCT method FROM submissions WHERE id IN (:ids)", {
    replacements: { ids: items.map((i) => i.id) },
    type: QueryTypes.SELECT,
  });
  const unverified = methods.some((m) => m.method === "unverified");
  if (unverified && methods.length > 1) {
    throw badRequest({ items: ["Approve unverified values in a batch of their own, apart from measured ones."] });
  }
  const results: BulkItemResult[] = [];
  for (const item of items) {
    try {
      const r = await sequelize.transaction((transaction) =>
        applyTransition(
          {
            submissionId: item.id,
            expectedVersion: item.version,
            allowedFrom: ["pending"],
            to: { status: "approved", moderatorNote: null },
            actorId: actor.id,
            action: "approve",
            reason: null,
            check: async (row, t) => {
              const scored = await scoredSubmission(row.id, t);
              const raised = scored ? flagsOfRow(scored).raised : [];
              if (raised.length > 0) {
                throw new ModerationRefusal(
                  409,
                  "flagged",
                  `Submission ${row.id} is flagged (${raised.map((f) => QUEUE_FLAG_LABELS[f].toLowerCase()).join(", ")}): review it on its own.`,
                );
              }
            },
          },
          transaction,
        ),
      );
      results.push({ id: item.id, outcome: "approved", version: r.after.version, eventId: r.eventId, changed: r.changed });
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      const conflict = error instanceof ModerationRefusal && error.refusal === "conflict";
      results.push({ id: item.id, outcome: conflict ? "conflict" : "refused", status: error.status, message: error.message });
    }
  }
  const ids = (outcome: BulkItemResult["outcome"]) => results.filter((r) => r.outcome === outcome).map((r) => r.id);
  return { results, approved: ids("approved"), conflicted: ids("conflict"), refused: ids("refused") };
}
