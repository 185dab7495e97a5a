"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, type DefaultValues, type FieldValues, type Path, type Resolver } from "react-hook-form";
import { z } from "zod";
import { asApiFetchError } from "@/components/form-errors";
import { useRevertEvent, useUpdateUser } from "@/components/hooks/use-moderation";
import { RevertBodySchema, UserPatchBodySchema, type RevertBody, type UserPatchBody } from "@/lib/moderation/schemas";
import { ROLES, ROLE_LABELS, STATUS_LABELS } from "@/lib/vocabulary";

// The admin page's two forms, each checked in the browser with the schema its endpoint uses and
// sent through apiFetch; a refusal's field messages show under the form, its message below them.

type Outcome = { ok: boolean; message: string } | null;

function OutcomeLine({ outcome }: { outcome: Outcome }) {
  if (!outcome) return null;
  return (
    <p role={outcome.ok ? "status" : "alert"} className={`text-small font-semibold ${outcome.ok ? "" : "text-fault"}`}>
      {outcome.message}
    </p>
  );
}

function FieldProblem({ message }: { message: string | undefined }) {
  return message ? <p className="w-full text-small font-semibold text-fault">{message}</p> : null;
}

/**
 * An admin form's one round: checked in the browser, sent by `send` (which says the success), and a
 * refusal's message shown as the outcome, its messages about `field` beside that field.
 */
function useAdminForm<V extends FieldValues, B>(
  resolver: Resolver<V, unknown, B>,
  defaultValues: DefaultValues<V>,
  field: Path<V>,
  send: (body: B) => Promise<string>,
) {
  const { register, handleSubmit, setError, formState } = useForm<V, unknown, B>({
    resolver,
    defaultValues,
    reValidateMode: "onSubmit",
    shouldFocusError: false,
  });
  const [outcome, setOutcome] = useState<Outcome>(null);
  const onSubmit = handleSubmit(async (body) => {
    setOutcome(null);
    try {
      setOutcome({ ok: true, message: await send(body) });
    } catch (error) {
      const refused = asApiFetchError(error);
      const messages = refused.fieldErrors[field];
      if (messages) setError(field, { type: "server", message: messages.join(" ") });
      setOutcome({ ok: false, message: refused.message });
    }
  });
  return { register, formState, outcome, onSubmit };
}

const TRUST_CHOICES = ["record", "yes", "no"] as const;
type UserFormValues = { role: string; trusted: (typeof TRUST_CHOICES)[number]; reason: string };

/** The form's selects and text as the endpoint's body, then the endpoint's own schema over it. */
const UserFormSchema = z
  .object({ role: z.string(), trusted: z.enum(TRUST_CHOICES), reason: z.string() })
  .transform(({ role, trusted, reason }): UserPatchBody => ({
    role: role as UserPatchBody["role"],
    trusted: trusted === "yes" ? true : trusted === "no" ? false : null,
    reason: reason.trim() || null,
  }))
  .pipe(UserPatchBodySchema);

export function UserForm({ user }: { user: { id: string; name: string; role: string; override: boolean | null } }) {
  const updateUser = useUpdateUser(user.id);
  const { register, formState, outcome, onSubmit } = useAdminForm<UserFormValues, UserPatchBody>(
    zodResolver(UserFormSchema),
    { role: user.role, trusted: user.override === true ? "yes" : user.override === false ? "no" : "record", reason: "" },
    "role",
    async (body) => {
      const { user: saved } = await updateUser.mutateAsync(body);
      return `Saved: ${saved.name} is now ${saved.role}, ${saved.trust.trusted ? "trusted" : "not trusted"}.`;
    },
  );
  const roleError = formState.errors.role?.message;
  const reasonError = formState.errors.reason?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-end gap-2" aria-label={`Role and trust of ${user.name}`}>
      <label className="flex flex-col text-small font-semibold">
        Role
        <select {...register("role")} className="sb-field min-h-11" aria-invalid={roleError ? "true" : undefined}>
          {ROLES.map((role) => (
            <option key={role} value={role}>
              {ROLE_LABELS[role]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col text-small font-semibold">
        Trust
        <select {...register("trusted")} className="sb-field min-h-11">
          <option value="record">By their record</option>
          <option value="yes">Always trusted</option>
          <option value="no">Never auto-approved</option>
        </select>
      </label>
      <label className="flex flex-col text-small font-semibold">
        Reason (optional)
        <input {...register("reason")} className="sb-field min-h-11" aria-invalid={reasonError ? "true" : undefined} />
      </label>
      <button type="submit" className="sb-button sb-button-quiet min-h-11" disabled={formState.isSubmitting}>
        Save
      </button>
      <FieldProblem message={roleError} />
      <FieldProblem message={reasonError} />
      <OutcomeLine outcome={outcome} />
    </form>
  );
}

/**
 * Reverting takes two steps: "Revert…" says what will happen and asks for the reason; only
 * "Yes, revert" sends it. Cancel closes it without a word to the server.
 */
export function RevertForm({ eventId, submissionId, restores }: { eventId: number; submissionId: number; restores: string }) {
  const revertEvent = useRevertEvent(eventId);
  const [confirming, setConfirming] = useState(false);
  const { register, formState, outcome, onSubmit } = useAdminForm<RevertBody, RevertBody>(
    zodResolver(RevertBodySchema),
    { reason: "" },
    "reason",
    async (body) => {
      const { submission } = await revertEvent.mutateAsync(body);
      setConfirming(false);
      return `Reverted: submission #${submission.id} is ${STATUS_LABELS[submission.status].toLowerCase()} again.`;
    },
  );
  const reasonError = formState.errors.reason?.message;
  const explained = `revert-explained-${eventId}`;
  if (!confirming)
    return (
      <div className="space-y-2">
        <button type="button" className="sb-button sb-button-quiet min-h-11" aria-expanded="false" onClick={() => setConfirming(true)}>
          Revert…
        </button>
        <OutcomeLine outcome={outcome} />
      </div>
    );
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      className="space-y-2 rounded-md border-2 border-caution-edge p-3"
      aria-label={`Revert this action on submission #${submissionId}`}
      aria-describedby={explained}
    >
      <p id={explained} className="text-small font-semibold">
        Submission #{submissionId} goes back to “{restores.toLowerCase()}”, the published figures are worked out again, and the contributor gets an e-mail.
        Nothing is deleted: the revert is logged too.
      </p>
      <div className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col text-small font-semibold">
          Why revert (required)
          <input {...register("reason")} className="sb-field min-h-11" aria-invalid={reasonError ? "true" : undefined} />
        </label>
        <button type="submit" className="sb-button min-h-11" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Reverting…" : "Yes, revert"}
        </button>
        <button type="button" className="sb-button sb-button-quiet min-h-11" onClick={() => setConfirming(false)} disabled={formState.isSubmitting}>
          Cancel
        </button>
      </div>
      <FieldProblem message={reasonError} />
      {/* a refusal about the reason is said beside it; anything else below */}
      {!reasonError && <OutcomeLine outcome={outcome} />}
    </form>
  );
}
