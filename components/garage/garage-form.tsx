"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import type { z } from "zod";

// One small form of the garage (a quad, a pack, a charge). The same zod schema as the server
// checks it first, so a bad reading is explained under its field before anything is sent; the
// server's field errors land in the same places. Saved rows appear by refreshing the server page.

export type GarageField = {
  name: string;
  label: string;
  type?: "text" | "number" | "date" | "textarea" | "select" | "checkbox";
  options?: readonly { value: string; label: string }[];
  hint?: string;
  step?: string;
  defaultValue?: string | boolean;
};

type Errors = Record<string, string[]>;

function valueOf(field: GarageField, form: FormData): unknown {
  const raw = form.get(field.name);
  if (field.type === "checkbox") return raw === "on";
  const text = typeof raw === "string" ? raw.trim() : "";
  if (field.type === "number") return text === "" ? null : Number(text);
  if (field.type === "select" && /^\d+$/.test(text) && field.name.endsWith("Id")) return Number(text);
  return text === "" ? null : text;
}

export function GarageForm({ title, action, schema, fields, submitLabel, testId }: {
  title: string;
  action: string;
  schema: z.ZodType;
  fields: GarageField[];
  submitLabel: string;
  testId?: string;
}) {
  const router = useRouter();
  const [errors, setErrors] = useState<Errors>({});
  const [busy, setBusy] = useState(false);
  const [formKey, setFormKey] = useState(0);

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const body = Object.fromEntries(fields.map((f) => [f.name, valueOf(f, form)]));
    const parsed = schema.safeParse(body);
    if (!parsed.success) {
      const next: Errors = {};
      for (const issue of parsed.error.issues) (next[issue.path.map(String).join(".") || "input"] ??= []).push(issue.message);
      setErrors(next);
      return;
    }
    setBusy(true);
    try {
      const res = await fetch(action, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
      if (!res.ok) {
        const { error } = await res.json().catch(() => ({ error: { message: "The server did not answer; try again.", fieldErrors: {} } }));
        setErrors(Object.keys(error.fieldErrors ?? {}).length ? error.fieldErrors : { input: [error.message] });
        return;
      }
      setErrors({});
      setFormKey((k) => k + 1);
      router.refresh();
    } finally {
      setBusy(false);
    }
  }

  const id = (name: string) => `${testId ?? "g"}-${name}`;
  return (
    <form key={formKey} onSubmit={submit} noValidate className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid={testId}>
      <h3 className="font-display text-lg font-bold tracking-wide uppercase">{title}</h3>
      {errors.input && <p role="alert" className="font-semibold text-fault">⚠ {errors.input.join(" ")}</p>}
      <div className="grid gap-3 sm:grid-cols-2">
        {fields.map((f) => {
          const message = errors[f.name]?.join(" ");
          const common = { id: id(f.name), name: f.name, "aria-invalid": message ? true : undefined, "aria-describedby": message ? `${id(f.name)}-error` : undefined };
          return (
            <div key={f.name} className={f.type === "textarea" ? "sm:col-span-2" : undefined}>
              {f.type === "checkbox" ? (
                <label className="flex items-center gap-2 font-semibold">
                  <input type="checkbox" {...common} defaultChecked={f.defaultValue === true} className="size-5" /> {f.label}
                </label>
              ) : (
                <>
                  <label htmlFor={id(f.name)} className="mb-1 block font-semibold">{f.label}</label>
                  {f.type === "textarea" ? (
                    <textarea {...common} rows={3} className="sb-field" />
                  ) : f.type === "select" ? (
                    <select {...common} className="sb-field" defaultValue={typeof f.defaultValue === "string" ? f.defaultValue : ""}>
                      {f.options?.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
                    </select>
                  ) : (
                    <input {...common} type={f.type ?? "text"} step={f.step} inputMode={f.type === "number" ? "decimal" : undefined} className="sb-field"
                      defaultValue={typeof f.defaultValue === "string" ? f.defaultValue : undefined} />
                  )}
                </>
              )}
              {f.hint && <p className="mt-1 text-small text-muted">{f.hint}</p>}
              {message && <p id={`${id(f.name)}-error`} className="mt-1 font-semibold text-fault"><span aria-hidden="true">⚠ </span>{message}</p>}
            </div>
          );
        })}
      </div>
      <button type="submit" className="sb-button" disabled={busy}>{busy ? "Saving…" : submitLabel}</button>
    </form>
  );
}
