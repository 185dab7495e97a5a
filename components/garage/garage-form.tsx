"use client";

import { useRouter } from "next/navigation";
import type { z } from "zod";
import { showServerErrors } from "@/components/form-errors";
import { useSchemaForm } from "@/components/hooks/use-schema-form";
import { useGarageSave } from "@/components/hooks/use-garage";
import type { ChosenBoard } from "@/lib/submissions/form-data";
import { BoardRevisionField } from "./board-revision-field";
import { useCloseEdit } from "./edit-toggle";

// One small form of the garage (a quad, a pack, a charge). The same zod schema as the server
// checks it first, so a bad reading is explained under its field before anything is sent; the
// server's field errors land in the same places. Saved rows appear by refreshing the server page.
// The same form adds a row (POST, then empties) and corrects one (PUT with its values, then closes).

export type GarageField = {
  name: string;
  label: string;
  type?: "text" | "number" | "date" | "textarea" | "select" | "checkbox" | "board";
  options?: readonly { value: string; label: string }[];
  hint?: string;
  step?: string;
  defaultValue?: string | boolean;
  /** For type "board": the board the revision belongs to, when one is chosen already. */
  board?: ChosenBoard | null;
  /** Shown (and sent) only while this holds for the values typed so far. */
  showWhen?: (values: Values) => boolean;
  /** A warning above the field, while it shows. */
  warning?: (values: Values) => string;
};

export type Values = Record<string, string | boolean>;

/** A field's value as the schema reads it: numbers and ids as numbers, empty text as null. */
function valueOf(field: GarageField, values: Values): unknown {
  const raw = values[field.name];
  if (field.type === "checkbox") return raw === true;
  const text = typeof raw === "string" ? raw.trim() : "";
  if (field.type === "number") return text === "" ? null : Number(text);
  if ((field.type === "select" || field.type === "board") && /^\d+$/.test(text) && field.name.endsWith("Id")) return Number(text);
  return text === "" ? null : text;
}

function defaultOf(field: GarageField): string | boolean {
  if (field.type === "checkbox") return field.defaultValue === true;
  if (typeof field.defaultValue === "string") return field.defaultValue;
  // a select without a default shows its first option, as the browser would
  return field.type === "select" ? (field.options?.[0]?.value ?? "") : "";
}

export function GarageForm({
  title,
  action,
  schema,
  fields,
  submitLabel,
  testId,
  method = "POST",
}: {
  title: string;
  action: string;
  schema: z.ZodType;
  fields: GarageField[];
  submitLabel: string;
  testId?: string;
  method?: "POST" | "PUT";
}) {
  const router = useRouter();
  const close = useCloseEdit();
  const save = useGarageSave(action, method);
  const shown = (f: GarageField, values: Values) => !f.showWhen || f.showWhen(values);
  const { form, errors } = useSchemaForm<Values>(schema, {
    defaultValues: Object.fromEntries(fields.map((f) => [f.name, defaultOf(f)])),
    toBody: (values) => Object.fromEntries(fields.filter((f) => shown(f, values)).map((f) => [f.name, valueOf(f, values)])),
    raw: true,
  });
  const values = form.watch();
  const busy = save.isPending;
  const submit = form.handleSubmit((body) =>
    save.mutate(body, {
      onSuccess: () => {
        if (method === "POST") form.reset();
        close?.();
        router.refresh();
      },
      onError: (e) => showServerErrors(form.setError, e),
    }),
  );

  const id = (name: string) => `${testId ?? "g"}-${name}`;
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid={testId}>
      <h3 className="font-display text-lg font-bold tracking-wide uppercase">{title}</h3>
      {errors.input && (
        <p role="alert" className="font-semibold text-fault">
          ⚠ {errors.input.join(" ")}
        </p>
      )}
      <div className="grid gap-3 sm:grid-cols-2">
        {fields.map((f) => {
          if (!shown(f, values)) return null;
          const message = errors[f.name]?.join(" ");
          const common = {
            id: id(f.name),
            ...form.register(f.name),
            "aria-invalid": message ? true : undefined,
            "aria-describedby": message ? `${id(f.name)}-error` : undefined,
          };
          return (
            <div key={f.name} className={f.type === "textarea" || f.type === "board" || f.warning ? "sm:col-span-2" : undefined}>
              {f.warning && (
                <p role="alert" className="mb-2 rounded-md border-2 border-caution-edge bg-caution p-2 font-semibold">
                  ⚠ {f.warning(values)}
                </p>
              )}
              {f.type === "board" ? (
                <BoardRevisionField
                  id={id(f.name)}
                  initialBoard={f.board ?? null}
                  register={form.register(f.name)}
                  setRevision={(value) => form.setValue(f.name, value)}
                  error={message}
                />
              ) : f.type === "checkbox" ? (
                <label className="flex items-center gap-2 font-semibold">
                  <input type="checkbox" {...common} className="size-5" /> {f.label}
                </label>
              ) : (
                <>
                  <label htmlFor={id(f.name)} className="mb-1 block font-semibold">
                    {f.label}
                  </label>
                  {f.type === "textarea" ? (
                    <textarea {...common} rows={3} className="sb-field" />
                  ) : f.type === "select" ? (
                    <select {...common} className="sb-field">
                      {f.options?.map((o) => (
                        <option key={o.value} value={o.value}>
                          {o.label}
                        </option>
                      ))}
                    </select>
                  ) : (
                    <input {...common} type={f.type ?? "text"} step={f.step} inputMode={f.type === "number" ? "decimal" : undefined} className="sb-field" />
                  )}
                </>
              )}
              {f.hint && <p className="mt-1 text-small text-muted">{f.hint}</p>}
              {message && f.type !== "board" && (
                <p id={`${id(f.name)}-error`} className="mt-1 font-semibold text-fault">
                  <span aria-hidden="true">⚠ </span>
                  {message}
                </p>
              )}
            </div>
          );
        })}
      </div>
      <button type="submit" className="sb-button" disabled={busy}>
        {busy ? "Saving…" : submitLabel}
      </button>
    </form>
  );
}
