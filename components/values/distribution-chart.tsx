"use client";

import { useState, type ReactNode } from "react";
import type { FamilyUnits, QuantityKey, QuantityValues } from "@/lib/published/board-values-types";
import type { Method } from "@/lib/vocabulary";
import { niceAxis } from "./axis";
import { QUANTITY_TITLES, settingMeaning, settingText } from "./quantity-meaning";
import { formatDate, formatMonth } from "@/lib/dates/format";
import { chartSummary, methodLabel } from "./summary";
import { ValuesTable } from "./values-table";

// One quantity's approved values over time: each value a dot, the median a line, its 95 % range
// a band, flagged outliers a red cross (shape and colour, so colour is never the only cue).
// Hovering a dot, or tapping it on a phone, shows its setting, method and date. The chart is an
// image to assistive technology, named and described by the text summary printed under it; the
// table of all values below it is the way to reach each value without a pointer. Plain SVG in a
// viewBox that scales with its box: no chart library in the page's JavaScript.

type Datum = { t: number; v: number; method: Method; date: string; outlier: boolean };

const DAY = 86_400_000;
const W = 360;
const H = 224;
const PAD = { left: 52, right: 10, top: 8, bottom: 26 };

function yAxis(q: QuantityValues, data: Datum[]) {
  const ys = [q.median, ...data.map((d) => d.v)];
  if (q.ciLow !== null && q.ciHigh !== null) ys.push(q.ciLow, q.ciHigh);
  const lo = Math.min(...ys);
  const hi = Math.max(...ys);
  // a little room so no dot sits on the frame
  const pad = hi > lo ? (hi - lo) * 0.06 : 0;
  return niceAxis(lo - pad, hi + pad);
}

function xDomain(data: Datum[]): [number, number] {
  if (data.length === 0) return [Date.now() - 30 * DAY, Date.now()];
  const lo = Math.min(...data.map((d) => d.t));
  const hi = Math.max(...data.map((d) => d.t));
  const pad = Math.max((hi - lo) * 0.04, 15 * DAY);
  return [lo - pad, hi + pad];
}

// Shapes get a large transparent disc around the mark: a fingertip-sized target on a phone.
type ShapeProps = { cx?: number; cy?: number };
function ValueDot({ cx = 0, cy = 0 }: ShapeProps) {
  return (
    <g data-mark="value">
      <circle cx={cx} cy={cy} r={14} fill="transparent" />
      <circle cx={cx} cy={cy} r={5} fill="var(--sb-copper)" stroke="var(--sb-surface)" strokeWidth={1.5} />
    </g>
  );
}
function OutlierMark({ cx = 0, cy = 0 }: ShapeProps) {
  const s = 6;
  return (
    <g data-mark="outlier">
      <circle cx={cx} cy={cy} r={14} fill="transparent" />
      <path
        d={`M${cx - s},${cy - s}L${cx + s},${cy + s}M${cx - s},${cy + s}L${cx + s},${cy - s}`}
        stroke="var(--sb-fault)"
        strokeWidth={3}
        strokeLinecap="round"
      />
    </g>
  );
}

function PointTooltip({ d, quantity, units }: { d: Datum; quantity: QuantityKey; units: FamilyUnits }) {
  const meaning = settingMeaning(quantity, d.v, units)[0];
  return (
    <div role="status" className="max-w-64 rounded-md border-2 border-rule bg-surface px-3 py-2 text-small shadow-lg" data-testid="value-tooltip">
      <p className="font-mono text-lg font-bold">{settingText(d.v)}</p>
      {meaning && <p className="text-muted">{meaning}</p>}
      <p className="mt-1">
        <span className="font-semibold">{methodLabel(d.method)}</span>
        <br />
        <time dateTime={d.date}>{formatDate(d.date)}</time>
      </p>
      {d.outlier && <p className="mt-1 font-bold text-fault">✕ Flagged as an outlier</p>}
    </div>
  );
}

function LegendItem({ children, swatch }: { children: string; swatch: ReactNode }) {
  return (
    <li className="inline-flex items-center gap-1.5">
      <svg width="22" height="14" viewBox="0 0 22 14" aria-hidden="true" focusable="false">
        {swatch}
      </svg>
      {children}
    </li>
  );
}

/** Four evenly spaced dates across the domain, labelled by month. */
function timeTicks([lo, hi]: [number, number]): number[] {
  return [0, 1, 2, 3].map((i) => lo + ((hi - lo) * (i + 0.5)) / 4);
}

export function DistributionChart({ quantity, values: q, units }: { quantity: QuantityKey; values: QuantityValues; units: FamilyUnits }) {
  // the point whose tooltip shows: hovered with a mouse, or tapped on a phone until the next tap
  const [active, setActive] = useState<number | null>(null);
  const data: Datum[] = (q.points ?? []).map((p) => ({ t: Date.parse(p.date), v: p.value, method: p.method, date: p.date, outlier: p.outlier }));
  const flagged = data.filter((d) => d.outlier);
  const hasCi = q.ciLow !== null && q.ciHigh !== null;
  const y = yAxis(q, data);
  const x = xDomain(data);
  const title = `${QUANTITY_TITLES[quantity]}: every approved value`;
  const summary = chartSummary(quantity, q, units);
  const titleId = `chart-${quantity}-title`;
  const summaryId = `chart-${quantity}-summary`;
  const plotW = W - PAD.left - PAD.right;
  const plotH = H - PAD.top - PAD.bottom;
  const xOf = (t: number) => PAD.left + ((t - x[0]) / (x[1] - x[0])) * plotW;
  const yOf = (v: number) => PAD.top + ((y.domain[1] - v) / (y.domain[1] - y.domain[0] || 1)) * plotH;
  const shown = active === null ? null : data[active];

  return (
    <figure aria-labelledby={titleId} className="min-w-0 rounded-md border-3 border-rule bg-surface px-3 pt-3 pb-4 sm:px-4" data-quantity={quantity}>
      <h4 id={titleId} className="font-display text-lg font-bold tracking-wide uppercase">
        {title}
      </h4>
      <div className="relative mt-2 w-full select-none" data-testid={`chart-${quantity}`}>
        <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full" role="img" aria-labelledby={titleId} aria-describedby={summaryId}>
          {y.ticks.map((t) => (
            <g key={t}>
              <line x1={PAD.left} x2={W - PAD.right} y1={yOf(t)} y2={yOf(t)} stroke="var(--sb-rule-soft)" />
              <text x={PAD.left - 6} y={yOf(t)} dy="0.35em" textAnchor="end" fontSize={12} fill="var(--sb-muted)">
                {settingText(t)}
              </text>
            </g>
          ))}
          {timeTicks(x).map((t) => (
            <text key={t} x={xOf(t)} y={H - 8} textAnchor="middle" fontSize={12} fill="var(--sb-muted)">
              {formatMonth(t)}
            </text>
          ))}
          <line x1={PAD.left} x2={W - PAD.right} y1={PAD.top + plotH} y2={PAD.top + plotH} stroke="var(--sb-rule)" />
          {hasCi && (
            <rect
              x={PAD.left}
              width={plotW}
              y={yOf(q.ciHigh!)}
              height={Math.max(1, yOf(q.ciLow!) - yOf(q.ciHigh!))}
              fill="var(--sb-verdigris)"
              fillOpacity={0.22}
              stroke="var(--sb-verdigris)"
              strokeOpacity={0.5}
            />
          )}
          <line x1={PAD.left} x2={W - PAD.right} y1={yOf(q.median)} y2={yOf(q.median)} stroke="var(--sb-ink)" strokeWidth={2} />
          {data.map((d, i) => (
            <g
              key={i}
              className="cursor-pointer"
              onPointerEnter={(e) => e.pointerType === "mouse" && setActive(i)}
              onPointerLeave={(e) => e.pointerType === "mouse" && setActive(null)}
              onClick={() => setActive((now) => (now === i ? null : i))}
            >
              {d.outlier ? <OutlierMark cx={xOf(d.t)} cy={yOf(d.v)} /> : <ValueDot cx={xOf(d.t)} cy={yOf(d.v)} />}
            </g>
          ))}
        </svg>
        {shown && (
          <div
            className="pointer-events-none absolute z-10"
            style={{
              left: `${(xOf(shown.t) / W) * 100}%`,
              top: `${(yOf(shown.v) / H) * 100}%`,
              transform: `translate(${xOf(shown.t) > W / 2 ? "-100%" : "0"}, -110%)`,
            }}
          >
            <PointTooltip d={shown} quantity={quantity} units={units} />
          </div>
        )}
      </div>
      <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-small" aria-label="Key">
        <LegendItem swatch={<circle cx="11" cy="7" r="5" fill="var(--sb-copper)" />}>Approved value</LegendItem>
        {flagged.length > 0 && (
          <LegendItem swatch={<path d="M5,1L17,13M5,13L17,1" stroke="var(--sb-fault)" strokeWidth="3" strokeLinecap="round" />}>Flagged outlier</LegendItem>
        )}
        <LegendItem swatch={<line x1="0" y1="7" x2="22" y2="7" stroke="var(--sb-ink)" strokeWidth="2" />}>Median</LegendItem>
        {hasCi && (
          <LegendItem swatch={<rect x="0" y="1" width="22" height="12" fill="var(--sb-verdigris)" fillOpacity="0.3" stroke="var(--sb-verdigris)" />}>
            95 % range for the median
          </LegendItem>
        )}
      </ul>
      <figcaption id={summaryId} className="mt-2 text-small">
        {summary}
      </figcaption>
      <ValuesTable quantity={quantity} values={q} />
    </figure>
  );
}
