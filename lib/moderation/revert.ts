import { UniqueConstraintError } from "sequelize";
import { badRequest } from "@/lib/http/errors";
import { db } from "@/models";
import { formatDateTime } from "@/lib/dates/format";
import { STATUS_LABELS, STATUSES } from "@/lib/vocabulary";
import { eventForRevert, getAuditEvent, submissionState, type AuditEventView, type RevertBlock } from "./audit";
import { fieldErrorsOf } from "@/lib/http/field-errors";
import { RevertBodySchema } from "./schemas";
import { applyTransition, ModerationRefusal } from "./transition";
import type { Actor, DecisionResult } from "./actions";

// An admin undoes a moderation decision: the submission gets back the status and note it had
// before the event, through a NEW event ('revert', pointing at the undone one); nothing is deleted
// or rewritten. Statistics and history are re-run like for any decision, so undoing an approval
// brings back exactly the figures published before it. Only the latest change of a submission can
// be undone (its version must still be the one the event left), so a revert never silently
// overwrites a later decision; undo the later one first. An event is reverted at most once
// (UNIQUE reverts_event_id); to redo, revert the revert.

const missingEvent = (id: number) =>
  new ModerationRefusal(404, "not_found", `There is no audit event with id ${id}.`, { id: [`There is no audit event with id ${id}.`] });

/** The refusal for each reason audit.ts's revertBlock gives: the same rule sets `revertable` in the log. */
function refusal(block: RevertBlock, event: AuditEventView): ModerationRefusal {
  switch (block) {
    case "not_admin":
      return new ModerationRefusal(403, "not_revertable", "Only an admin can revert a decision.");
    case "not_submission":
      return new ModerationRefusal(
        409,
        "not_revertable",
        "Only decisions on submissions can be reverted; change a user's role or trust back with another change.",
      );
    case "already_reverted": {
      const by = event.revertedBy;
      const who = by ? `${by.actor?.name ?? "someone"} on ${formatDateTime(by.at)}` : "someone";
      return new ModerationRefusal(409, "already_reverted", `This action was already reverted by ${who}; revert that revert to redo it.`);
    }
    case "no_state":
      return new ModerationRefusal(409, "not_revertable", "This event does not record a submission's status, so there is nothing to restore.");
    case "moved_on":
      return new ModerationRefusal(409, "conflict", "The submission changed after this action; revert its later actions first, newest first.", {
        id: ["the submission has moved on since this action"],
      });
    case "own_submission":
      return new ModerationRefusal(403, "own_submission", "Another admin has to revert a decision on your own submission.");
  }
}

/** Reverts event `eventId`; body { reason }. 404 unknown event, 403 own submission, 409 when it cannot be undone (see above). */
export async function revertEvent(actor: Actor, eventId: number, body: unknown): Promise<DecisionResult> {
  const parsed = RevertBodySchema.safeParse(body ?? {});
  if (!parsed.success) throw badRequest(fieldErrorsOf(parsed.error.issues));
  const { reason } = parsed.data;
  // the route lets only admins call this (role("admin")), so the actor is judged as one
  const found = await eventForRevert(eventId, { id: actor.id, role: "admin" });
  if (!found) throw missingEvent(eventId);
  const { event, block } = found;
  if (block || event.entity.type !== "submission") throw refusal(block ?? "not_submission", event);
  const before = submissionState(event.before)!;
  const after = submissionState(event.after)!;

  const submissionId = event.entity.id;
  const sequelize = db();
  let result;
  try {
    result = await sequelize.transaction((transaction) =>
      applyTransition(
        {
          submissionId,
          expectedVersion: after.version,
          allowedFrom: STATUSES,
          to: { status: before.status, moderatorNote: before.moderatorNote },
          actorId: actor.id,
          action: "revert",
          reason,
          revertsEventId: eventId,
          staleError: (_sent, current) =>
            new ModerationRefusal(
              409,
              "conflict",
              `Submission ${submissionId} changed after this action (it is now ${STATUS_LABELS[current.status].toLowerCase()}); revert its later actions first, newest first.`,
              { id: ["the submission has moved on since this action"] },
            ),
        },
        transaction,
      ),
    );
  } catch (error) {
    // two admins reverting one event at the same moment: the row lock makes the second see the
    // new version first, and the unique index is the guarantee behind it
    if (error instanceof UniqueConstraintError) throw new ModerationRefusal(409, "already_reverted", "This action was just reverted by someone else.");
    throw error;
  }
  const view = (await getAuditEvent(result.eventId))!;
  return {
    submission: { id: submissionId, status: result.after.status, version: result.after.version, moderatorNote: result.after.moderatorNote },
    event: view,
    changed: result.changed,
  };
}
