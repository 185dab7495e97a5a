"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { startInput } from "@/lib/worksheets/recharge-input";

// Starts a fly-and-recharge worksheet on a quad. The starting scale is the board's published value
// when there is one (the server decides); the builder's own is asked for only as a fallback.
export function StartWorksheet({ quadId }: { quadId: number }) {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [busy, setBusy] = useState(false);

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const f = new FormData(event.currentTarget);
    const num = (k: string) => (String(f.get(k) ?? "").trim() === "" ? null : Number(f.get(k)));
    const body = { quadId, ratedMah: num("ratedMah"), cells: num("cells"), startingScale: num("startingScale") };
    const parsed = startInput.safeParse(body);
    if (!parsed.success) {
      const next: Record<string, string[]> = {};
      for (const i of parsed.error.issues) (next[i.path.join(".") || "input"] ??= []).push(i.message);
      return setErrors(next);
    }
    setBusy(true);
    const res = await fetch("/api/v1/garage/worksheets", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }).finally(() => setBusy(false));
    const json = await res.json().catch(() => null);
    if (!res.ok) {
      const e = json?.error ?? { message: "The server did not answer; try again.", fieldErrors: {} };
      return setErrors(Object.keys(e.fieldErrors ?? {}).length ? e.fieldErrors : { input: [e.message] });
    }
    router.push(`/garage/worksheets/${json.worksheet.id}`);
  }

  const field = (name: string, label: string, hint?: string) => (
    <div>
      <label htmlFor={`s-${name}`} className="mb-1 block font-semibold">{label}</label>
      <input id={`s-${name}`} name={name} type="number" inputMode="numeric" className="sb-field" aria-invalid={errors[name] ? true : undefined} />
      {hint && <p className="mt-1 text-small text-muted">{hint}</p>}
      {errors[name] && <p className="mt-1 font-semibold text-fault"><span aria-hidden="true">⚠ </span>{errors[name].join(" ")}</p>}
    </div>
  );
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid="start-worksheet">
      <h3 className="font-display text-lg font-bold tracking-wide uppercase">Start a fly-and-recharge worksheet</h3>
      {errors.input && <p role="alert" className="font-semibold text-fault">⚠ {errors.input.join(" ")}</p>}
      {errors.quadId && <p role="alert" className="font-semibold text-fault">⚠ {errors.quadId.join(" ")}</p>}
      <div className="grid gap-3 sm:grid-cols-3">
        {field("cells", "Pack cells (S)")}
        {field("ratedMah", "Pack rated mAh")}
        {field("startingScale", "Current scale flown now", "Only needed when nothing is published for this board yet")}
      </div>
      <button type="submit" className="sb-button" disabled={busy}>{busy ? "Starting…" : "Start worksheet"}</button>
    </form>
  );
}
