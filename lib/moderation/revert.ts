import { UniqueConstraintError } from "sequelize";
import { badRequest } from "@/lib/http/errors";
import { db } from "@/models";
import { STATUSES } from "@/lib/vocabulary";
import { getAuditEvent, type SubmissionState } from "./audit";
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

function submissionState(value: Record<string, unknown>): SubmissionState | null {
  const { status, moderatorNote, version } = value as Partial<SubmissionState>;
  if (!STATUSES.includes(status as never) || typeof version !== "number" || (moderatorNote !== null && typeof moderatorNote !== "string")) return null;
  return { status: status!, moderatorNote: moderatorNote ?? null, version };
}

/** Reverts event `eventId`; body { reason }. 404 unknown event, 409 when it cannot be undone (see above). */
export async function revertEvent(actor: Actor, eventId: number, body: unknown): Promise<DecisionResult> {
  const parsed = RevertBodySchema.safeParse(body ?? {});
  if (!parsed.success) throw badRequest(fieldErrorsOf(parsed.error.issues));
  const { reason } = parsed.data;
  const event = await getAuditEvent(eventId);
  if (!event) throw missingEvent(eventId);
  if (event.entity.type !== "submission") {
    throw new ModerationRefusal(
      409,
      "not_revertable",
      "Only decisions on submissions can be reverted; change a user's role or trust back with another change.",
    );
  }
  if (event.revertedByEventId !== null) {
    throw new ModerationRefusal(409, "already_reverted", `This action was already reverted by event ${event.revertedByEventId}; revert that one to redo it.`);
  }
  const before = submissionState(event.before);
  const after = submissionState(event.after);
  if (!before || !after)
    throw new ModerationRefusal(409, "not_revertable", "This event does not record a submission's status, so there is nothing to restore.");

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
              `Submission ${submissionId} changed after this action (it is now ${current.status}, version ${current.version}); revert its later actions first, newest first.`,
              { id: [`submission ${submissionId} has moved on since event ${eventId}`] },
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
