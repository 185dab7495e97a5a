"use client";

import type { ReactNode } from "react";
import type { FieldErrors, FieldValues, Path, UseFormRegister } from "react-hook-form";

// Labelled inputs for the account forms. Each shows its own message under it, tied to the input
// with aria-describedby and aria-invalid, so a screen reader reads the reason with the field.

export function TextField<T extends FieldValues>({
  form,
  name,
  label,
  hint,
  type = "text",
  autoComplete,
  idPrefix,
}: {
  form: { register: UseFormRegister<T>; errors: FieldErrors<T> };
  name: Path<T>;
  label: ReactNode;
  hint?: ReactNode;
  type?: "text" | "email" | "password";
  autoComplete?: string;
  /** Keeps ids unique when two forms on one page have a field of the same name. */
  idPrefix: string;
}) {
  const id = `${idPrefix}-${name}`;
  const error = form.errors[name]?.message as string | undefined;
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(" ") || undefined;
  return (
    <div>
      <label htmlFor={id} className="mb-1 block font-semibold">
        {label}
      </label>
      <input
        id={id}
        type={type}
        autoComplete={autoComplete}
        spellCheck={false}
        autoCapitalize={type === "text" ? undefined : "none"}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`sb-field ${error ? "border-fault" : ""}`}
        {...form.register(name)}
      />
      {hint && (
        <p id={`${id}-hint`} className="mt-1 text-small text-muted">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="mt-1 font-semibold text-fault">
          <span aria-hidden="true">⚠ </span>
          {error}
        </p>
      )}
    </div>
  );
}

/** A message about the whole form (the server's answer), announced when it appears. */
export function FormMessage({ tone, children }: { tone: "fault" | "done"; children: ReactNode }) {
  const style = tone === "fault" ? "border-fault bg-fault-wash" : "border-verdigris bg-surface";
  return (
    <div role={tone === "fault" ? "alert" : "status"} className={`rounded-md border-3 ${style} p-3 font-semibold`}>
      {children}
    </div>
  );
}

/** An account form's submit button: off while the form is sending, and saying so when it has a `busyLabel`. */
export function SubmitButton({
  submitting,
  busyLabel,
  className = "sb-button w-full sm:w-auto",
  children,
}: {
  submitting: boolean;
  busyLabel?: string;
  className?: string;
  children: ReactNode;
}) {
  return (
    <button type="submit" className={className} disabled={submitting}>
      {submitting && busyLabel ? busyLabel : children}
    </button>
  );
}

/** A new password and the same again (field "confirm"), as every form that sets one asks for them. */
export function NewPasswordFields<T extends FieldValues>({
  form,
  idPrefix,
  name,
  label,
  hint,
}: {
  form: { register: UseFormRegister<T>; errors: FieldErrors<T> };
  idPrefix: string;
  name: Path<T>;
  label: string;
  hint: ReactNode;
}) {
  return (
    <>
      <TextField form={form} idPrefix={idPrefix} name={name} label={label} type="password" autoComplete="new-password" hint={hint} />
      <TextField form={form} idPrefix={idPrefix} name={"confirm" as Path<T>} label={`${label} again`} type="password" autoComplete="new-password" />
    </>
  );
}
