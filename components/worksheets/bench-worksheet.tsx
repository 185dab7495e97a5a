"use client";

import { useMemo, useState } from "react";
import { CartesianGrid, ReferenceLine, Scatter, ScatterChart, XAxis, YAxis } from "recharts";
import { BenchCaution } from "@/components/submission/cautions";
import { benchWorksheet, type WorksheetFamily } from "@/lib/calibration/worksheets";
import { formatFigure } from "@/lib/catalogue/format";

// The bench worksheet: clamp-meter current beside the OSD's at several throttle points, fitted by
// lib/calibration/worksheets/bench.ts as the builder types. Nothing is stored. It means props on
// and motors under load, so the caution comes first and fly-and-recharge is suggested instead.

type Row = { measuredAmps: string; reportedAmps: string };
const num = (s: string) => (s.trim() === "" ? (undefined as unknown as number) : Number(s));

export function BenchWorksheetForm({ family, startingScale, startingOffset }: { family: WorksheetFamily; startingScale: number | null; startingOffset: number | null }) {
  const [scale, setScale] = useState(startingScale == null ? "" : String(startingScale));
  const [offset, setOffset] = useState(String(startingOffset ?? 0));
  const [rows, setRows] = useState<Row[]>([{ measuredAmps: "", reportedAmps: "" }, { measuredAmps: "", reportedAmps: "" }]);
  const touched = rows.some((r) => r.measuredAmps || r.reportedAmps);
  const result = useMemo(
    () => benchWorksheet({ scaleUsed: num(scale), offsetUsed: num(offset), points: rows.map((r) => ({ measuredAmps: num(r.measuredAmps), reportedAmps: num(r.reportedAmps) })) }, family),
    [scale, offset, rows, family],
  );
  const errors = new Map<string, string[]>();
  if (!result.ok) for (const e of result.errors) errors.set(e.field, [...(errors.get(e.field) ?? []), e.message]);
  const err = (field: string) => (touched ? errors.get(field) : undefined);
  const set = (i: number, key: keyof Row, value: string) => setRows((rs) => rs.map((r, j) => (j === i ? { ...r, [key]: value } : r)));
  const input = (id: string, label: string, value: string, onChange: (v: string) => void, field: string) => (
    <div>
      <label htmlFor={id} className="mb-1 block font-semibold">{label}</label>
      <input id={id} type="number" inputMode="decimal" className="sb-field" value={value} onChange={(e) => onChange(e.target.value)} aria-invalid={err(field) ? true : undefined} />
      {err(field) && <p className="mt-1 font-semibold text-fault"><span aria-hidden="true">⚠ </span>{err(field)!.join(" ")}</p>}
    </div>
  );
  const v = result.ok ? result.value : null;

  return (
    <div className="space-y-5">
      <p className="rounded-md border-2 border-rule bg-surface p-3 font-semibold">
        Most builders should use the fly-and-recharge worksheet instead: it needs no props-on bench run and the charger is the reference.
      </p>
      <BenchCaution />
      <div className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid="bench-form">
        <div className="grid gap-3 sm:grid-cols-2">
          {input("b-scale", "Current scale in force", scale, setScale, "scaleUsed")}
          {input("b-offset", "Current offset in force", offset, setOffset, "offsetUsed")}
        </div>
        {rows.map((r, i) => (
          <fieldset key={i} className="grid gap-3 border-t border-rule pt-3 sm:grid-cols-2">
            <legend className="font-semibold">Point {i + 1}</legend>
            {input(`b-${i}-m`, "Clamp meter (A)", r.measuredAmps, (x) => set(i, "measuredAmps", x), `points.${i}.measuredAmps`)}
            {input(`b-${i}-r`, "OSD current (A)", r.reportedAmps, (x) => set(i, "reportedAmps", x), `points.${i}.reportedAmps`)}
          </fieldset>
        ))}
        {err("points") && <p className="font-semibold text-fault">⚠ {err("points")!.join(" ")}</p>}
        <button type="button" className="sb-button sb-button-quiet" onClick={() => setRows((rs) => [...rs, { measuredAmps: "", reportedAmps: "" }])}>Add another point</button>
      </div>
      {v && touched && (
        <section aria-labelledby="b-result" className="space-y-3 rounded-md border-3 border-rule bg-surface p-4" data-testid="bench-result">
          <h2 id="b-result" className="font-display text-heading uppercase">Fit</h2>
          <p className="text-small">
            Gain <span className="font-mono">{formatFigure(v.fit.gain, 4)}</span>, intercept <span className="font-mono">{formatFigure(v.fit.interceptAmps, 2)} A</span>,
            r² <span className="font-mono">{formatFigure(v.fit.rSquared, 4)}</span> over {v.fit.n} points ({v.fit.method}).
          </p>
          <p>
            Current scale: exact <span className="font-mono">{formatFigure(v.scaleRounding.exact, 2)}</span>, down <span className="font-mono">{v.scaleRounding.down.setting}</span>, up{" "}
            <span className="font-mono">{v.scaleRounding.up.setting}</span>; enter <strong className="font-mono">{v.scaleRounding.recommended.setting}</strong>. {v.scaleRounding.why}
          </p>
          <p>Current offset: enter <strong className="font-mono">{v.offset.setting}</strong> (leaves {formatFigure(v.offset.displayedErrorAmpsAtZero, 3)} A at zero current).</p>
          <figure aria-label="Residuals: OSD minus fitted current at each point" className="h-48 w-full select-none">
            <ScatterChart responsive style={{ width: "100%", height: "100%" }} margin={{ top: 8, right: 12, bottom: 0, left: 0 }}>
              <CartesianGrid stroke="var(--sb-rule-soft)" vertical={false} />
              <ReferenceLine y={0} stroke="var(--sb-ink)" />
              <XAxis type="number" dataKey="measuredAmps" name="clamp meter" unit=" A" stroke="var(--sb-rule)" tick={{ fill: "var(--sb-muted)" }} />
              <YAxis type="number" dataKey="residualAmps" name="residual" unit=" A" width={52} stroke="var(--sb-rule)" tick={{ fill: "var(--sb-muted)" }} />
              <Scatter data={v.residuals} fill="var(--sb-copper)" isAnimationActive={false} />
            </ScatterChart>
          </figure>
        </section>
      )}
      {result.warnings.length > 0 && touched && (
        <ul className="space-y-1 rounded-md border-2 border-caution-edge bg-caution p-3 text-small">{result.warnings.map((w) => <li key={w.field + w.message}>⚠ {w.message}</li>)}</ul>
      )}
    </div>
  );
}
