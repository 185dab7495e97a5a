"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { showServerErrors } from "@/components/form-errors";
import { useSchemaForm } from "@/components/hooks/use-schema-form";
import { usePacks } from "@/components/hooks/use-garage";
import { useStartWorksheet } from "@/components/hooks/use-worksheet";
import { CHEMISTRY_LIMITS } from "@/lib/calibration/chemistry";
import { startInput } from "@/lib/worksheets/recharge-input";
import { numberOrNull } from "./saved-worksheet";

// Starts a fly-and-recharge worksheet on a quad. The starting scale field offers the board's
// published value when there is one; whatever the builder leaves there is what the worksheet uses.
// Choosing one of the builder's packs (GET /api/v1/garage/packs) fills in its cells and rated mAh,
// which stay editable; which pack it was is stored too, so that pack is archived rather than deleted once the worksheet is published.

type StartFields = { cells: string; ratedMah: string; startingScale: string };
const NO_ANSWER = "The server did not answer; try again.";

export function StartWorksheet({ quadId, publishedScale }: { quadId: number; publishedScale: number | null }) {
  const router = useRouter();
  const [packId, setPackId] = useState("");
  const packs = usePacks();
  const { form, errors } = useSchemaForm<StartFields>(startInput, {
    defaultValues: { cells: "", ratedMah: "", startingScale: publishedScale == null ? "" : String(publishedScale) },
    toBody: (v) => ({
      quadId,
      packId: packId === "" ? null : Number(packId),
      ratedMah: numberOrNull(v.ratedMah),
      cells: numberOrNull(v.cells),
      startingScale: numberOrNull(v.startingScale),
    }),
    raw: true,
  });
  const start = useStartWorksheet<{ id: number }>((sheet) => router.push(`/garage/worksheets/${sheet.id}`), {
    unreachableMessage: NO_ANSWER,
    fallbackMessage: () => NO_ANSWER,
  });
  const [cells, ratedMah] = form.watch(["cells", "ratedMah"]);
  const chosen = packs.data?.find((p) => String(p.id) === packId) ?? null;
  const edited = chosen != null && (cells !== String(chosen.cells) || ratedMah !== String(chosen.ratedMah));
  const busy = start.isPending;

  function choosePack(id: string) {
    setPackId(id);
    const pack = packs.data?.find((p) => String(p.id) === id);
    if (pack) {
      form.setValue("cells", String(pack.cells));
      form.setValue("ratedMah", String(pack.ratedMah));
    }
  }

  const submit = form.handleSubmit((body) => start.mutate(body, { onError: (e) => showServerErrors(form.setError, e) }));

  const field = (name: keyof StartFields, label: string, hint?: string) => (
    <div>
      <label htmlFor={`s-${name}`} className="mb-1 block font-semibold">
        {label}
      </label>
      <input id={`s-${name}`} type="number" inputMode="numeric" className="sb-field" aria-invalid={errors[name] ? true : undefined} {...form.register(name)} />
      {hint && <p className="mt-1 text-small text-muted">{hint}</p>}
      {errors[name] && (
        <p className="mt-1 font-semibold text-fault">
          <span aria-hidden="true">⚠ </span>
          {errors[name].join(" ")}
        </p>
      )}
    </div>
  );
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid="start-worksheet">
      <h3 className="font-display text-lg font-bold tracking-wide uppercase">Start a fly-and-recharge worksheet</h3>
      {errors.input && (
        <p role="alert" className="font-semibold text-fault">
          ⚠ {errors.input.join(" ")}
        </p>
      )}
      {errors.quadId && (
        <p role="alert" className="font-semibold text-fault">
          ⚠ {errors.quadId.join(" ")}
        </p>
      )}
      {packs.data && packs.data.length > 0 && (
        <div>
          <label htmlFor="s-pack" className="mb-1 block font-semibold">
            Pack
          </label>
          <select id="s-pack" className="sb-field" value={packId} onChange={(e) => choosePack(e.target.value)} aria-describedby="s-pack-hint">
            <option value="">Not one of my packs: type the figures</option>
            {packs.data.map((p) => (
              <option key={p.id} value={p.id}>
                {p.label} · {p.cells}S {p.ratedMah} mAh {CHEMISTRY_LIMITS[p.chemistry].label}
              </option>
            ))}
          </select>
          <p id="s-pack-hint" className="mt-1 text-small text-muted" data-testid="pack-hint">
            {chosen
              ? edited
                ? `Started from ${chosen.label}, then changed by you.`
                : `Cells and rated mAh filled in from ${chosen.label}; change them if your pack differs.`
              : "Choose one from your garage to fill in its cells and rated mAh."}
          </p>
        </div>
      )}
      {packs.error && <p className="text-small text-muted">{packs.error.message}</p>}
      <div className="grid gap-3 sm:grid-cols-3">
        {field("cells", "Pack cells (S)")}
        {field("ratedMah", "Pack rated mAh")}
        {field(
          "startingScale",
          "Current scale flown now",
          publishedScale == null
            ? "Nothing is published for this board yet: enter the scale your quad flies with."
            : "The board's published value; change it if your quad flies with another.",
        )}
      </div>
      <button type="submit" className="sb-button" disabled={busy}>
        {busy ? "Starting…" : "Start worksheet"}
      </button>
    </form>
  );
}
