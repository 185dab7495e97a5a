"use client";

import type { ReactNode } from "react";
import { get, useFormContext, useFormState, type FieldErrors, type Path } from "react-hook-form";
import { numberFromInput, type SubmissionDraft } from "./draft";

// Labelled inputs bound to the submission form. Every field shows its own message under it,
// linked with aria-describedby, so a screen reader reads the reason with the field.

export type DraftPath = Path<SubmissionDraft>;

/** "cycles.2.chargedMah" → "f-cycles-2-chargedMah": the id the error summary links to. */
export const fieldId = (name: string) => `f-${name.replace(/\./g, "-")}`;

/** The message at a path, including one set on an array or a section as a whole. */
export function errorAt(errors: FieldErrors<SubmissionDraft>, name: string): string | undefined {
  const e = get(errors, name) as { message?: string; root?: { message?: string } } | undefined;
  return e?.message ?? e?.root?.message;
}

export function useFieldError(name: string): string | undefined {
  const { errors } = useFormState<SubmissionDraft>();
  return errorAt(errors, name);
}

export function ErrorText({ id, message }: { id: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="mt-1 font-semibold text-fault">
      <span aria-hidden="true">⚠ </span>
      {message}
    </p>
  );
}

function Frame({ name, label, hint, error, children }: { name: string; label: ReactNode; hint?: ReactNode; error?: string; children: ReactNode }) {
  const id = fieldId(name);
  return (
    <div>
      <label htmlFor={id} className="mb-1 block font-semibold">
        {label}
      </label>
      {children}
      {hint && (
        <p id={`${id}-hint`} className="mt-1 text-small text-muted">
          {hint}
        </p>
      )}
      <ErrorText id={`${id}-error`} message={error} />
    </div>
  );
}

const describedBy = (name: string, hint: unknown, error: unknown) =>
  [hint ? `${fieldId(name)}-hint` : null, error ? `${fieldId(name)}-error` : null].filter(Boolean).join(" ") || undefined;

export function NumberField({
  name,
  label,
  hint,
  unit,
  kind = "decimal",
}: {
  name: DraftPath;
  label: ReactNode;
  hint?: ReactNode;
  unit?: string;
  /** whole: a positive count; decimal: a positive measurement; signed: may be negative (phones then show the full keyboard). */
  kind?: "whole" | "decimal" | "signed";
}) {
  const { register } = useFormContext<SubmissionDraft>();
  const error = useFieldError(name);
  const inputMode = kind === "whole" ? "numeric" : kind === "decimal" ? "decimal" : "text";
  return (
    <Frame name={name} label={label} hint={hint} error={error}>
      <div className="flex items-stretch">
        <input
          id={fieldId(name)}
          type="text"
          inputMode={inputMode}
          autoComplete="off"
          spellCheck={false}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(name, hint, error)}
          className={`sb-field font-mono ${unit ? "rounded-r-none" : ""} ${error ? "border-fault" : ""}`}
          {...register(name, { setValueAs: numberFromInput })}
        />
        {unit && (
          <span className="inline-flex items-center rounded-r-md border-2 border-l-0 border-rule bg-sunken px-3 font-mono text-small whitespace-nowrap">
            {unit}
          </span>
        )}
      </div>
    </Frame>
  );
}

export function SelectField({
  name,
  label,
  hint,
  placeholder,
  options,
  asNumber = false,
}: {
  name: DraftPath;
  label: ReactNode;
  hint?: ReactNode;
  placeholder?: string;
  options: readonly { value: string | number; label: string }[];
  asNumber?: boolean;
}) {
  const { register } = useFormContext<SubmissionDraft>();
  const error = useFieldError(name);
  return (
    <Frame name={name} label={label} hint={hint} error={error}>
      <select
        id={fieldId(name)}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(name, hint, error)}
        className={`sb-field ${error ? "border-fault" : ""}`}
        {...register(name, asNumber ? { setValueAs: (v) => (v === "" || v == null ? null : Number(v)) } : {})}
      >
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Frame>
  );
}

export function TextField({
  name,
  label,
  hint,
  placeholder,
  multiline = false,
  maxLength,
}: {
  name: DraftPath;
  label: ReactNode;
  hint?: ReactNode;
  placeholder?: string;
  multiline?: boolean;
  maxLength?: number;
}) {
  const { register } = useFormContext<SubmissionDraft>();
  const error = useFieldError(name);
  const common = {
    id: fieldId(name),
    placeholder,
    maxLength,
    "aria-invalid": error ? true : undefined,
    "aria-describedby": describedBy(name, hint, error),
    className: `sb-field ${error ? "border-fault" : ""}`,
    ...register(name),
  };
  return (
    <Frame name={name} label={label} hint={hint} error={error}>
      {multiline ? <textarea rows={5} {...common} /> : <input type="text" autoComplete="off" spellCheck={false} {...common} />}
    </Frame>
  );
}
