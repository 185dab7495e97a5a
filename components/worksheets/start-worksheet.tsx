"use client";

import { useQuery } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState, type ChangeEvent, type FormEvent } from "react";
import { CHEMISTRY_LIMITS } from "@/lib/calibration/chemistry";
import type { PackView } from "@/lib/garage/packs";
import { startInput } from "@/lib/worksheets/recharge-input";

// Starts a fly-and-recharge worksheet on a quad. The starting scale is the board's published value
// when there is one (the server decides); the builder's own is asked for only as a fallback.
// Choosing one of the builder's packs (GET /api/v1/garage/packs) fills in its cells and rated mAh,
// which stay editable; which pack it was is not stored, so the worksheet is the same either way.

type PackChoice = Pick<PackView, "id" | "label" | "chemistry" | "cells" | "ratedMah">;

async function fetchPacks(signal: AbortSignal): Promise<PackChoice[]> {
  const res = await fetch("/api/v1/garage/packs", { signal, headers: { accept: "application/json" } });
  if (!res.ok) throw new Error(`Your packs did not load (HTTP ${res.status}); type the figures instead.`);
  return ((await res.json()) as { packs: PackChoice[] }).packs;
}

export function StartWorksheet({ quadId }: { quadId: number }) {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [busy, setBusy] = useState(false);
  const [values, setValues] = useState({ cells: "", ratedMah: "" });
  const [packId, setPackId] = useState("");
  const packs = useQuery({ queryKey: ["garage-packs"], queryFn: ({ signal }) => fetchPacks(signal) });
  const chosen = packs.data?.find((p) => String(p.id) === packId) ?? null;
  const edited = chosen != null && (values.cells !== String(chosen.cells) || values.ratedMah !== String(chosen.ratedMah));

  function choosePack(id: string) {
    setPackId(id);
    const pack = packs.data?.find((p) => String(p.id) === id);
    if (pack) setValues({ cells: String(pack.cells), ratedMah: String(pack.ratedMah) });
  }

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

  // cells and rated mAh are held in state so a chosen pack can fill them; the scale is left to the form
  const bound = (name: "cells" | "ratedMah") => ({ value: values[name], onChange: (e: ChangeEvent<HTMLInputElement>) => setValues((v) => ({ ...v, [name]: e.target.value })) });
  const field = (name: string, label: string, hint?: string, controlled?: ReturnType<typeof bound>) => (
    <div>
      <label htmlFor={`s-${name}`} className="mb-1 block font-semibold">{label}</label>
      <input id={`s-${name}`} name={name} type="number" inputMode="numeric" className="sb-field" aria-invalid={errors[name] ? true : undefined}
        {...controlled} />
      {hint && <p className="mt-1 text-small text-muted">{hint}</p>}
      {errors[name] && <p className="mt-1 font-semibold text-fault"><span aria-hidden="true">⚠ </span>{errors[name].join(" ")}</p>}
    </div>
  );
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid="start-worksheet">
      <h3 className="font-display text-lg font-bold tracking-wide uppercase">Start a fly-and-recharge worksheet</h3>
      {errors.input && <p role="alert" className="font-semibold text-fault">⚠ {errors.input.join(" ")}</p>}
      {errors.quadId && <p role="alert" className="font-semibold text-fault">⚠ {errors.quadId.join(" ")}</p>}
      {packs.data && packs.data.length > 0 && (
        <div>
          <label htmlFor="s-pack" className="mb-1 block font-semibold">Pack</label>
          <select id="s-pack" className="sb-field" value={packId} onChange={(e) => choosePack(e.target.value)} aria-describedby="s-pack-hint">
            <option value="">Not one of my packs: type the figures</option>
            {packs.data.map((p) => (
              <option key={p.id} value={p.id}>{p.label} · {p.cells}S {p.ratedMah} mAh {CHEMISTRY_LIMITS[p.chemistry].label}</option>
            ))}
          </select>
          <p id="s-pack-hint" className="mt-1 text-small text-muted" data-testid="pack-hint">
            {chosen ? (edited ? `Started from ${chosen.label}, then changed by you.` : `Cells and rated mAh filled in from ${chosen.label}; change them if your pack differs.`) : "Choose one from your garage to fill in its cells and rated mAh."}
          </p>
        </div>
      )}
      {packs.error && <p className="text-small text-muted">{packs.error.message}</p>}
      <div className="grid gap-3 sm:grid-cols-3">
        {field("cells", "Pack cells (S)", undefined, bound("cells"))}
        {field("ratedMah", "Pack rated mAh", undefined, bound("ratedMah"))}
        {field("startingScale", "Current scale flown now", "Only needed when nothing is published for this board yet")}
      </div>
      <button type="submit" className="sb-button" disabled={busy}>{busy ? "Starting…" : "Start worksheet"}</button>
    </form>
  );
}
