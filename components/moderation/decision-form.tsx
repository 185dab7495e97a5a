"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm, useWatch, type Resolver } from "react-hook-form";
import { asApiFetchError } from "@/components/form-errors";
import { useDecide } from "@/components/hooks/use-moderation";
import { ApproveBodySchema, RejectBodySchema, RequestChangesBodySchema } from "@/lib/moderation/schemas";
import type { DecisionResult } from "@/lib/moderation/actions";
import type { Decision } from "@/lib/vocabulary";

type Props = {
  id: number;
  version: number;
  /** False once decided: only the confirmation (if this form made it) or a note shows. */
  open: boolean;
};

const TEXT_FIELD: Record<Decision, { name: "note" | "reason" | "message"; label: string; hint: string; required: boolean }> = {
  approve: { name: "note", label: "Note to the contributor (optional)", hint: "Shown with the approval.", required: false },
  reject: { name: "reason", label: "Reason", hint: "Required: the contributor reads it in their e-mail.", required: true },
  request_changes: { name: "message", label: "What should change", hint: "Required: the contributor reads it and can edit the submission.", required: true },
};
const BUTTON: Record<Decision, string> = { approve: "Approve", reject: "Reject", request_changes: "Ask for changes" };
const BODY_SCHEMAS = { approve: ApproveBodySchema, reject: RejectBodySchema, request_changes: RequestChangesBodySchema } as const;
const DONE: Record<DecisionResult["submission"]["status"], string> = {
  approved: "approved",
  rejected: "rejected",
  changes_requested: "sent back for changes",
  pending: "left pending",
};

type Values = { decision: Decision; text: string };
type Body = Record<string, unknown>;

/** The body the decision's endpoint takes: one text field, named by the decision; an empty optional note is left out as null. */
function bodyOf({ decision, text }: Values, version: number): Body {
  const field = TEXT_FIELD[decision];
  return { version, [field.name]: text.trim() || (field.required ? text : null) };
}

/**
 * Checks the body with the decision's own schema (the one its endpoint uses), so an empty reason
 * is refused here with the server's words; the message for the text's field lands on the textarea.
 */
function decisionResolver(version: number): Resolver<Values, unknown, Body> {
  return async (values, context, options) => {
    const name = TEXT_FIELD[values.decision].name;
    const result = await zodResolver(BODY_SCHEMAS[values.decision])(bodyOf(values, version) as never, context, options as never);
    if (Object.keys(result.errors).length === 0) return { values: result.values as Body, errors: {} };
    const { [name]: text, ...others } = result.errors as Record<string, { type: string; message?: string }>;
    return { values: {}, errors: { ...others, ...(text ? { text } : {}) } } as never;
  };
}

// Approve, reject (a reason) or ask for changes (a message). Empty required text is refused here
// with the same words as the server; the server's own refusals land beside the field.
export function DecisionForm({ id, version, open }: Props) {
  const decide = useDecide(id);
  const { register, handleSubmit, control, setError, clearErrors, formState } = useForm<Values, unknown, Body>({
    resolver: decisionResolver(version),
    defaultValues: { decision: "approve", text: "" },
    // a message stays until the next try and focus stays where it is, as this form has always behaved
    reValidateMode: "onSubmit",
    shouldFocusError: false,
  });
  const [refusal, setRefusal] = useState<{ message: string; conflict: boolean } | null>(null);
  // useWatch rather than watch(): React Compiler can memoise a component that subscribes this way
  const decision = useWatch({ control, name: "decision" });
  const field = TEXT_FIELD[decision];
  const error = formState.errors.text?.message;

  const onSubmit = handleSubmit(async (body) => {
    setRefusal(null);
    try {
      await decide.mutateAsync({ decision, body });
    } catch (e) {
      const refused = asApiFetchError(e);
      const messages = refused.fieldErrors[field.name];
      if (messages?.length) setError("text", { type: "server", message: messages.join(" ") });
      setRefusal({ message: refused.message, conflict: refused.status === 409 });
    }
  });

  if (decide.isSuccess) {
    return (
      <div role="status" className="space-y-2 rounded-md border-3 border-verdigris bg-surface p-4">
        <p className="font-semibold">
          Submission #{id} {DONE[decide.data.submission.status]}. The contributor gets an e-mail.
        </p>
        <Link href="/moderation">Back to the queue</Link>
      </div>
    );
  }
  if (!open) return <p className="rounded-md border-3 border-rule bg-surface p-4">This submission has been decided.</p>;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4 rounded-md border-3 border-rule bg-surface p-4" aria-label="Decision">
      <fieldset>
        <legend className="font-display text-lg font-bold tracking-wide uppercase">Decision</legend>
        <div className="mt-2 flex flex-wrap gap-3">
          {(Object.keys(BUTTON) as Decision[]).map((d) => (
            <label key={d} className="inline-flex min-h-11 items-center gap-2 rounded-md border-2 border-rule px-3 font-semibold">
              <input
                type="radio"
                value={d}
                {...register("decision", {
                  onChange: () => {
                    clearErrors();
                    setRefusal(null);
                  },
                })}
                className="size-5"
              />
              {BUTTON[d]}
            </label>
          ))}
        </div>
      </fieldset>
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
          aria-invalid={error ? "true" : undefined}
          aria-describedby={error ? "decision-hint decision-error" : "decision-hint"}
          className="sb-field w-full"
        />
        {error && (
          <p id="decision-error" className="font-semibold text-fault">
            {error}
          </p>
        )}
      </div>
      {refusal?.message && (
        <p role="alert" className="rounded-md border-2 border-fault p-3 font-semibold text-fault">
          {refusal.message} {refusal.conflict && <a href={`/moderation/${id}`}>Reload this submission</a>}
        </p>
      )}
      <button type="submit" className="sb-button min-h-11" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Sending…" : BUTTON[decision]}
      </button>
    </form>
  );
}
