"use client";

import { useMemo, useState } from "react";
import { ProbeCaution } from "@/components/submission/cautions";
import { voltageWorksheet, type WorksheetFamily } from "@/lib/calibration/worksheets";
import { formatFigure } from "@/lib/catalogue/format";

// The voltage worksheet: pairs of OSD and multimeter readings, worked out as the builder types by
// lib/calibration/worksheets/voltage.ts. Nothing is stored; the figures are a moment's check.

type Row = { cells: string; reportedVolts: string; measuredVolts: string };
const blank = (cells = ""): Row => ({ cells, reportedVolts: "", measuredVolts: "" });
const num = (s: string) => (s.trim() === "" ? (undefined as unknown as number) : Number(s));

export function VoltageWorksheetForm({ family, startingScale }: { family: WorksheetFamily; startingScale: number | null }) {
  const [scale, setScale] = useState(startingScale == null ? "" : String(startingScale));
  const [rows, setRows] = useState<Row[]>([blank()]);
  const touched = rows.some((r) => r.reportedVolts || r.measuredVolts);
  const result = useMemo(
    () => voltageWorksheet({ scaleUsed: num(scale), readings: rows.map((r) => ({ cells: num(r.cells), reportedVolts: num(r.reportedVolts), measuredVolts: num(r.measuredVolts) })) }, family),
    [scale, rows, family],
  );
  const errors = new Map<string, string[]>();
  if (!result.ok) for (const e of result.errors) errors.set(e.field, [...(errors.get(e.field) ?? []), e.message]);
  const err = (field: string) => (touched ? errors.get(field) : undefined);
  const set = (i: number, key: keyof Row, value: string) => setRows((rs) => rs.map((r, j) => (j === i ? { ...r, [key]: value } : r)));

  const input = (id: string, label: string, value: string, onChange: (v: string) => void, field: string, hint?: string) => (
    <div>
      <label htmlFor={id} className="mb-1 block font-semibold">{label}</label>
      <input id={id} type="number" inputMode="decimal" className="sb-field" value={value} onChange={(e) => onChange(e.target.value)} aria-invalid={err(field) ? true : undefined} />
      {hint && <p className="mt-1 text-small text-muted">{hint}</p>}
      {err(field) && <p className="mt-1 font-semibold text-fault"><span aria-hidden="true">⚠ </span>{err(field)!.join(" ")}</p>}
    </div>
  );

  return (
    <div className="space-y-5">
      <ProbeCaution />
      <div className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid="voltage-form">
        {input("v-scale", "Voltage scale in force", scale, setScale, "scaleUsed", startingScale != null ? "The board's published recommended value, until you enter yours" : undefined)}
        {rows.map((r, i) => (
          <fieldset key={i} className="grid gap-3 border-t border-rule pt-3 sm:grid-cols-3">
            <legend className="font-semibold">Reading {i + 1}</legend>
            {input(`v-${i}-cells`, "Cells (S)", r.cells, (v) => set(i, "cells", v), `readings.${i}.cells`)}
            {input(`v-${i}-rep`, "OSD voltage (V)", r.reportedVolts, (v) => set(i, "reportedVolts", v), `readings.${i}.reportedVolts`, "The whole pack, at rest")}
            {input(`v-${i}-meas`, "Multimeter (V)", r.measuredVolts, (v) => set(i, "measuredVolts", v), `readings.${i}.measuredVolts`, "Taken at the same moment")}
          </fieldset>
        ))}
        <button type="button" className="sb-button sb-button-quiet" onClick={() => setRows((rs) => [...rs, blank(rs.at(-1)?.cells ?? "")])}>Add another reading</button>
      </div>
      {result.ok && touched && (
        <section aria-labelledby="v-result" className="space-y-2 rounded-md border-3 border-rule bg-surface p-4" data-testid="voltage-result">
          <h2 id="v-result" className="font-display text-heading uppercase">{result.value.verdict === "keep" ? "Keep the scale" : "Change the scale"}</h2>
          <p>{result.value.message}</p>
          <p className="text-small">
            Exact scale <span className="font-mono">{formatFigure(result.value.impliedScale, 2)}</span> ({result.value.combination}); down{" "}
            <span className="font-mono">{result.value.rounding.down.setting}</span>, up <span className="font-mono">{result.value.rounding.up.setting}</span>; recommended{" "}
            <strong className="font-mono">{result.value.rounding.recommended.setting}</strong>. {result.value.rounding.why}
          </p>
          <p className="text-small text-muted">Tolerance ±{result.value.tolerance.relative * 100} % ({result.value.tolerance.source}).</p>
        </section>
      )}
      {result.warnings.length > 0 && touched && (
        <ul className="space-y-1 rounded-md border-2 border-caution-edge bg-caution p-3 text-small">{result.warnings.map((w) => <li key={w.field + w.message}>⚠ {w.message}</li>)}</ul>
      )}
    </div>
  );
}
