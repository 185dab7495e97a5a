"use client";

import type { ReactNode } from "react";
import type { UseFormRegisterReturn } from "react-hook-form";
import type { Errors } from "@/components/form-errors";

// The pieces the saved worksheets share on the client: a number field, the messages under it, the
// warnings, the publish panel and the list of saved entries. Their reads and writes are the
// react-query hooks in components/hooks/use-worksheet.ts; their forms are useSchemaForm's.

export type { Errors };

/** A number box's text as the schemas read it: undefined when empty (so the schema says "Enter …"). */
export const numberOrUndefined = (text: string | undefined) => {
  const raw = (text ?? "").trim();
  return raw === "" ? undefined : Number(raw);
};

/** The same, null when empty: what the fly-and-recharge schemas expect of an empty box. */
export const numberOrNull = (text: string | undefined) => numberOrUndefined(text) ?? null;

export function FieldError({ id, messages }: { id?: string; messages?: string[] }) {
  if (!messages?.length) return null;
  return (
    <p id={id} className="mt-1 font-semibold text-fault">
      <span aria-hidden="true">⚠ </span>
      {messages.join(" ")}
    </p>
  );
}

export function NumberInput(props: { idPrefix: string; field: UseFormRegisterReturn; label: string; errors: Errors; hint?: string }) {
  const id = `${props.idPrefix}-${props.field.name}`;
  const messages = props.errors[props.field.name];
  return (
    <div className="min-w-0">
      <label htmlFor={id} className="mb-1 block font-semibold">
        {props.label}
      </label>
      <input
        id={id}
        type="number"
        inputMode="decimal"
        step="any"
        className="sb-field"
        {...props.field}
        aria-invalid={messages ? true : undefined}
        aria-describedby={messages ? `${id}-error` : undefined}
      />
      {props.hint && <p className="mt-1 text-small text-muted">{props.hint}</p>}
      <FieldError id={`${id}-error`} messages={messages} />
    </div>
  );
}

export function Warnings({ items }: { items: Array<{ field: string; message: string }> }) {
  if (!items.length) return null;
  return (
    <ul className="space-y-1 rounded-md border-2 border-caution-edge bg-caution p-3 text-small" data-testid="worksheet-warnings">
      {items.map((w) => (
        <li key={w.field + w.message}>⚠ {w.message}</li>
      ))}
    </ul>
  );
}

/** Publish when finished; once published, which submission it became. */
export function PublishPanel(props: { submissionId: number | null; ready: boolean; busy: boolean; errors: Errors; onPublish: () => void; what: ReactNode }) {
  if (props.submissionId != null)
    return (
      <p className="font-semibold" data-testid="published">
        Published as submission #{props.submissionId}: pending review.
      </p>
    );
  if (!props.ready) return null;
  const messages = Object.values(props.errors).flat();
  return (
    <div className="space-y-2">
      <FieldError messages={messages} />
      <button type="button" className="sb-button w-full sm:w-auto" onClick={props.onPublish} disabled={props.busy} data-testid="publish">
        Publish to Shuntbook
      </button>
      <p className="text-small text-muted">{props.what} A moderator reviews it like any other contribution.</p>
    </div>
  );
}

/**
 * The saved readings or points of a worksheet, numbered, with "take back" on the last while the
 * worksheet is open, and the taken-back ones kept below, struck out and not counted.
 */
export function SavedEntries<E extends { position: number }, R extends { removedAt: string }>(props: {
  id: string;
  title: string;
  testId: string;
  entries: readonly E[];
  removed: readonly R[];
  describe: (entry: E | R) => ReactNode;
  open: boolean;
  busy: boolean;
  onRemove: (position: number) => void;
  removeErrors: Errors;
}) {
  const last = props.entries.at(-1);
  return (
    <>
      {props.entries.length > 0 && (
        <section aria-labelledby={props.id} className="space-y-2">
          <h2 id={props.id} className="font-display text-lg font-bold tracking-wide uppercase">
            {props.title}
          </h2>
          <ol className="space-y-2" data-testid={props.testId}>
            {props.entries.map((entry) => (
              <li key={entry.position} className="flex flex-wrap items-center justify-between gap-2 rounded-md border-2 border-rule bg-surface p-3">
                <span>
                  <span className="font-semibold">{entry.position + 1}.</span> {props.describe(entry)}
                </span>
                {props.open && entry === last && (
                  <button type="button" className="sb-button sb-button-quiet" disabled={props.busy} onClick={() => props.onRemove(entry.position)}>
                    Take back
                  </button>
                )}
              </li>
            ))}
          </ol>
          <FieldError messages={Object.values(props.removeErrors).flat()} />
        </section>
      )}
      <TakenBack removed={props.removed} describe={props.describe} />
    </>
  );
}

/** The entries a builder took back: kept, struck out, not counted. Nothing when there are none. */
export function TakenBack<R extends { removedAt: string }>({ removed, describe }: { removed: readonly R[]; describe: (entry: R) => ReactNode }) {
  if (removed.length === 0) return null;
  return (
    <details className="text-small">
      <summary className="text-muted">{removed.length} taken back (kept here, not counted)</summary>
      <ul className="mt-1 space-y-1">
        {removed.map((entry) => (
          <li key={entry.removedAt}>
            <del>{describe(entry)}</del>
          </li>
        ))}
      </ul>
    </details>
  );
}
