"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useEffect, useRef, useState } from "react";
import { useForm, useWatch, type Resolver } from "react-hook-form";
import { asApiFetchError } from "@/components/form-errors";
import { useDecide } from "@/components/hooks/use-moderation";
import { ApproveBodySchema, FlaggedApproveBodySchema, RejectBodySchema, RequestChangesBodySchema } from "@/lib/moderation/schemas";
import type { DecisionResult } from "@/lib/moderation/actions";
import type { Decision } from "@/lib/vocabulary";

type Props = {
  id: number;
  version: number;
  /** False once decided: only the confirmation (if this form made it) or a note shows. */
  open: boolean;
  /** A value is far from the others or the evidence disagrees: approving it needs a written reason (the server insists too). */
  flagged: boolean;
  /** The submission a moderator meets next in the queue (same filters), or null when nothing else waits. */
  next: { href: string; label: string } | null;
  /** The queue with the filters the moderator came from. */
  queueHref: string;
};

type FieldName = "note" | "reason" | "message";
type Field = { name: FieldName; label: string; hint: string };

/** The decision's main text field; approving a flagged submission asks for a reason AND offers the optional note. */
function mainField(decision: Decision, flagged: boolean): Field {
  if (decision === "approve" && flagged)
    return {
      name: "reason",
      label: "Why approve it although it is flagged",
      hint: "Required: a value far from the others, or evidence that disagrees, is approved only with a reason. It stays in the log.",
    };
  if (decision === "approve") return { name: "note", label: "Note to the contributor (optional)", hint: "Shown with the approval." };
  if (decision === "reject") return { name: "reason", label: "Reason", hint: "Required: the contributor reads it in their e-mail." };
  return { name: "message", label: "What should change", hint: "Required: the contributor reads it and can edit the submission." };
}

const BUTTON: Record<Decision, string> = { approve: "Approve", reject: "Reject", request_changes: "Ask for changes" };
const DONE: Record<DecisionResult["submission"]["status"], string> = {
  approved: "approved",
  rejected: "rejected",
  changes_requested: "sent back for changes",
  pending: "left pending",
};
const CHOOSE = "Choose approve, reject or ask for changes first.";

type Values = { decision: Decision | ""; text: string; note: string };
type Body = Record<string, unknown>;

const schemaFor = (decision: Decision, flagged: boolean) =>
  decision === "approve" ? (flagged ? FlaggedApproveBodySchema : ApproveBodySchema) : decision === "reject" ? RejectBodySchema : RequestChangesBodySchema;

/** The body the decision's endpoint takes; an empty optional text is left out as null, an empty required one is sent as typed (and refused). */
function bodyOf({ decision, text, note }: Values, version: number, flagged: boolean): Body {
  if (!decision) return { version };
  const field = mainField(decision, flagged);
  const body: Body = { version, [field.name]: text.trim() || (field.name === "note" ? null : text) };
  if (decision === "approve" && flagged) body.note = note.trim() || null;
  return body;
}

/**
 * Checks the body with the schema its endpoint applies (the flagged approval's own when flagged),
 * so an empty reason is refused here with the server's words; nothing is chosen until the
 * moderator chooses, and sending without a choice says so.
 */
function decisionResolver(version: number, flagged: boolean): Resolver<Values, unknown, Body> {
  return async (values, context, options) => {
    if (!values.decision) return { values: {}, errors: { decision: { type: "required", message: CHOOSE } } } as never;
    const main = mainField(values.decision, flagged).name;
    const result = await zodResolver(schemaFor(values.decision, flagged))(bodyOf(values, version, flagged) as never, context, options as never);
    if (Object.keys(result.errors).length === 0) return { values: result.values as Body, errors: {} };
    const { [main]: text, ...others } = result.errors as Record<string, { type: string; message?: string }>;
    return { values: {}, errors: { ...others, ...(text ? { text } : {}) } } as never;
  };
}

function Problem({ id, message }: { id: string; message: string | undefined }) {
  return message ? (
    <p id={id} className="font-semibold text-fault">
      {message}
    </p>
  ) : null;
}

// Approve, reject (a reason) or ask for changes (a message): nothing is chosen beforehand, and a
// flagged submission is approved only with a reason. Empty required text is refused here with the
// same words as the server; the server's own refusals land beside the field. After a decision the
// next submission in the queue is one tap away.
export function DecisionForm({ id, version, open, flagged, next, queueHref }: Props) {
  const decide = useDecide(id);
  const { register, handleSubmit, control, setError, clearErrors, formState } = useForm<Values, unknown, Body>({
    resolver: decisionResolver(version, flagged),
    defaultValues: { decision: "", text: "", note: "" },
    // a message stays until the next try and focus stays where it is, as this form has always behaved
    reValidateMode: "onSubmit",
    shouldFocusError: false,
  });
  const [refusal, setRefusal] = useState<{ message: string; conflict: boolean } | null>(null);
  const done = useRef<HTMLDivElement>(null);
  // useWatch rather than watch(): React Compiler can memoise a component that subscribes this way
  const decision = useWatch({ control, name: "decision" });
  const field = decision ? mainField(decision, flagged) : null;
  const errors = formState.errors;
  const textError = errors.text?.message;
  const noteError = errors.note?.message;
  const decisionError = errors.decision?.message;

  useEffect(() => {
    if (decide.isSuccess) done.current?.focus();
  }, [decide.isSuccess]);

  const onSubmit = handleSubmit(async (body) => {
    setRefusal(null);
    if (!decision) return;
    try {
      await decide.mutateAsync({ decision, body });
    } catch (e) {
      const refused = asApiFetchError(e);
      const main = mainField(decision, flagged).name;
      const onText = refused.fieldErrors[main];
      if (onText?.length) setError("text", { type: "server", message: onText.join(" ") });
      const onNote = main !== "note" ? refused.fieldErrors.note : undefined;
      if (onNote?.length) setError("note", { type: "server", message: onNote.join(" ") });
      setRefusal({ message: refused.message, conflict: refused.status === 409 });
    }
  });

  if (decide.isSuccess) {
    return (
      <div ref={done} tabIndex={-1} role="status" className="space-y-2 rounded-md border-3 border-verdigris bg-surface p-4">
        <p className="font-semibold">
          Submission #{id} {DONE[decide.data.submission.status]}. The contributor gets an e-mail.
        </p>
        {next ? (
          <p>
            <Link href={next.href} className="sb-button inline-flex min-h-11 items-center no-underline">
              Next in queue: {next.label}
            </Link>
          </p>
        ) : (
          <p>Nothing else waits in this part of the queue.</p>
        )}
        <p>
          <Link href={queueHref}>Back to the queue</Link>
        </p>
      </div>
    );
  }
  if (!open)
    return (
      <div className="space-y-2 rounded-md border-3 border-rule bg-surface p-4">
        <p>This submission has been decided.</p>
        {next && (
          <p>
            <Link href={next.href}>Next in queue: {next.label}</Link>
          </p>
        )}
      </div>
    );
  const clear = () => {
    clearErrors();
    setRefusal(null);
  };
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4 rounded-md border-3 border-rule bg-surface p-4" aria-label="Decision">
      <fieldset aria-describedby={decisionError ? "decision-choice-error" : undefined}>
        <legend className="font-display text-lg font-bold tracking-wide uppercase">Decision</legend>
        {flagged && <p className="mt-1 text-small">This submission is flagged: approving it needs a reason.</p>}
        <div className="mt-2 flex flex-wrap gap-3">
          {(Object.keys(BUTTON) as Decision[]).map((d) => (
            <label key={d} className="inline-flex min-h-11 items-center gap-2 rounded-md border-2 border-rule px-3 font-semibold has-checked:border-ink">
              <input
                type="radio"
                value={d}
                {...register("decision", { onChange: clear })}
                aria-invalid={decisionError ? "true" : undefined}
                className="size-5"
              />
              {BUTTON[d]}
            </label>
          ))}
        </div>
        <Problem id="decision-choice-error" message={decisionError} />
      </fieldset>
      {field && (
        <div className="flex flex-col gap-1">
          <label htmlFor="decision-text" className="font-semibold">
            {field.label}
          </label>
          <p id="decision-hint" className="text-small text-muted">
            {field.hint}
          </p>
          <textarea
            id="decision-text"
            rows={4}
            {...register("text")}
            aria-invalid={textError ? "true" : undefined}
            aria-describedby={textError ? "decision-hint decision-error" : "decision-hint"}
            className="sb-field w-full"
          />
          <Problem id="decision-error" message={textError} />
        </div>
      )}
      {decision === "approve" && flagged && (
        <div className="flex flex-col gap-1">
          <label htmlFor="decision-note" className="font-semibold">
            Note to the contributor (optional)
          </label>
          <textarea
            id="decision-note"
            rows={3}
            {...register("note")}
            aria-invalid={noteError ? "true" : undefined}
            aria-describedby={noteError ? "decision-note-error" : undefined}
            className="sb-field w-full"
          />
          <Problem id="decision-note-error" message={noteError} />
        </div>
      )}
      {refusal?.message && (
        <p role="alert" className="rounded-md border-2 border-fault p-3 font-semibold text-fault">
          {refusal.message} {refusal.conflict && <a href={`/moderation/${id}`}>Reload this submission</a>}
        </p>
      )}
      <button type="submit" className="sb-button min-h-11" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Sending…" : decision ? BUTTON[decision] : "Send decision"}
      </button>
    </form>
  );
}
