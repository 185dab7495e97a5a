"use client";

import Link from "next/link";
import { useState, useTransition } from "react";
import type { DecisionState } from "@/app/moderation/[id]/actions";
import type { Decision } from "@/lib/vocabulary";

type Props = {
  id: number;
  version: number;
  /** False once decided: only the confirmation (if this form made it) or a note shows. */
  open: boolean;
  act: (id: number, decision: Decision, body: Record<string, unknown>) => Promise<DecisionState>;
};

const TEXT_FIELD: Record<Decision, { name: string; label: string; hint: string; required: boolean }> = {
  approve: { name: "note", label: "Note to the contributor (optional)", hint: "Shown with the approval.", required: false },
  reject: { name: "reason", label: "Reason", hint: "Required: the contributor reads it in their e-mail.", required: true },
  request_changes: { name: "message", label: "What should change", hint: "Required: the contributor reads it and can edit the submission.", required: true },
};
const BUTTON: Record<Decision, string> = { approve: "Approve", reject: "Reject", request_changes: "Ask for changes" };

// Approve, reject (a reason) or ask for changes (a message). Empty required text is refused here
// with the same words as the server; the server's own refusals land beside the field.
export function DecisionForm({ id, version, act, open }: Props) {
  const [decision, setDecision] = useState<Decision>("approve");
  const [text, setText] = useState("");
  const [state, setState] = useState<DecisionState>(null);
  const [pending, start] = useTransition();
  const field = TEXT_FIELD[decision];
  const errors = state?.fieldErrors?.[field.name] ?? [];

  function submit(e: React.FormEvent) {
    e.preventDefault();
    if (field.required && !text.trim()) {
      setState({ ok: false, message: "", fieldErrors: { [field.name]: [decision === "reject" ? "Say why the submission is rejected: the contributor reads it" : "Say what should change: the contributor reads it"] }, conflict: false });
      return;
    }
    start(async () => setState(await act(id, decision, { version, [field.name]: text.trim() || (field.required ? text : null) })));
  }

  if (state?.ok) {
    return (
      <div role="status" className="space-y-2 rounded-md border-3 border-verdigris bg-surface p-4">
        <p className="font-semibold">{state.message}</p>
        <Link href="/moderation">Back to the queue</Link>
      </div>
    );
  }
  if (!open) return <p className="rounded-md border-3 border-rule bg-surface p-4">This submission has been decided.</p>;
  return (
    <form onSubmit={submit} noValidate className="space-y-4 rounded-md border-3 border-rule bg-surface p-4" aria-label="Decision">
      <fieldset>
        <legend className="font-display text-lg font-bold tracking-wide uppercase">Decision</legend>
        <div className="mt-2 flex flex-wrap gap-3">
          {(Object.keys(BUTTON) as Decision[]).map((d) => (
            <label key={d} className="inline-flex min-h-11 items-center gap-2 rounded-md border-2 border-rule px-3 font-semibold">
              <input type="radio" name="decision" value={d} checked={decision === d} onChange={() => { setDecision(d); setState(null); }} className="size-5" />
              {BUTTON[d]}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="flex flex-col gap-1">
        <label htmlFor="decision-text" className="font-semibold">{field.label}</label>
        <p id="decision-hint" className="text-small text-muted">{field.hint}</p>
        <textarea
          id="decision-text"
          rows={4}
          value={text}
          onChange={(e) => setText(e.target.value)}
          aria-invalid={errors.length > 0 ? "true" : undefined}
          aria-describedby={errors.length ? "decision-hint decision-error" : "decision-hint"}
          className="sb-field w-full"
        />
        {errors.length > 0 && (
          <p id="decision-error" className="font-semibold text-fault">
            {errors.join(" ")}
          </p>
        )}
      </div>
      {state && !state.ok && state.message && (
        <p role="alert" className="rounded-md border-2 border-fault p-3 font-semibold text-fault">
          {state.message} {state.conflict && <a href={`/moderation/${id}`}>Reload this submission</a>}
        </p>
      )}
      <button type="submit" className="sb-button min-h-11" disabled={pending}>
        {pending ? "Sending…" : BUTTON[decision]}
      </button>
    </form>
  );
}
