"use client";

import { useSyncExternalStore, type ReactNode } from "react";
import { CartesianGrid, ReferenceArea, ReferenceLine, Scatter, ScatterChart, Tooltip, XAxis, YAxis, type TooltipContentProps } from "recharts";
import type { FamilyUnits, QuantityKey, QuantityValues } from "@/lib/published/board-values-types";
import type { Method } from "@/lib/vocabulary";
import { niceAxis } from "./axis";
import { QUANTITY_TITLES, settingMeaning, settingText } from "./quantity-meaning";
import { chartSummary, dayOf, methodLabel, monthOf } from "./summary";
import { ValuesTable } from "./values-table";

// One quantity's approved values over time: each value a dot, the median a line, its 95 % range
// a band, flagged outliers a red cross (shape and colour, so colour is never the only cue).
// Hovering a dot, or tapping it on a phone, shows its setting, method and date. The chart is an
// image to assistive technology, named and described by the text summary printed under it; the
// table of all values below it is the way to reach each value without a pointer.

type Datum = { t: number; v: number; method: Method; date: string; outlier: boolean };

const DAY = 86_400_000;

// Phones have no hover: there a tap pins the tooltip until the next tap (recharts' click trigger).
const NO_HOVER = "(hover: none)";
function subscribeHover(onChange: () => void) {
  const mq = window.matchMedia(NO_HOVER);
  mq.addEventListener("change", onChange);
  return () => mq.removeEventListener("change", onChange);
}
const useNoHover = () =>
  useSyncExternalStore(
    subscribeHover,
    () => window.matchMedia(NO_HOVER).matches,
    () => false,
  );

/** Both axes are drawn alike: muted tick text on the rule colour. */
const AXIS_LOOK = { tick: { fill: "var(--sb-muted)", fontSize: 13 }, stroke: "var(--sb-rule)" };

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

function PointTooltip({ active, payload, quantity, units }: TooltipContentProps & { quantity: QuantityKey; units: FamilyUnits }) {
  const d = active ? (payload?.[0]?.payload as Datum | undefined) : undefined;
  if (!d) return null;
  const meaning = settingMeaning(quantity, d.v, units)[0];
  return (
    <div role="status" className="max-w-64 rounded-md border-2 border-rule bg-surface px-3 py-2 text-small shadow-lg" data-testid="value-tooltip">
      <p className="font-mono text-lg font-bold">{settingText(d.v)}</p>
      {meaning && <p className="text-muted">{meaning}</p>}
      <p className="mt-1">
        <span className="font-semibold">{methodLabel(d.method)}</span>
        <br />
        <time dateTime={d.date}>{dayOf(d.date)}</time>
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

export function DistributionChart({ quantity, values: q, units }: { quantity: QuantityKey; values: QuantityValues; units: FamilyUnits }) {
  const noHover = useNoHover();
  const data: Datum[] = (q.points ?? []).map((p) => ({ t: Date.parse(p.date), v: p.value, method: p.method, date: p.date, outlier: p.outlier }));
  const regular = data.filter((d) => !d.outlier);
  const flagged = data.filter((d) => d.outlier);
  const hasCi = q.ciLow !== null && q.ciHigh !== null;
  const y = yAxis(q, data);
  const title = `${QUANTITY_TITLES[quantity]}: every approved value`;
  const summary = chartSummary(quantity, q, units);
  const titleId = `chart-${quantity}-title`;
  const summaryId = `chart-${quantity}-summary`;

  return (
    <figure aria-labelledby={titleId} className="min-w-0 rounded-md border-3 border-rule bg-surface px-3 pt-3 pb-4 sm:px-4" data-quantity={quantity}>
      <h4 id={titleId} className="font-display text-lg font-bold tracking-wide uppercase">
        {title}
      </h4>
      {/* fixed height: no layout jump when the chart mounts after hydration */}
      <div className="mt-2 h-56 w-full select-none" data-testid={`chart-${quantity}`}>
        <ScatterChart
          responsive
          style={{ width: "100%", height: "100%" }}
          margin={{ top: 8, right: 8, bottom: 0, left: 0 }}
          accessibilityLayer={false}
          role="img"
          aria-labelledby={titleId}
          aria-describedby={summaryId}
          title={title}
          desc={summary}
        >
          <CartesianGrid stroke="var(--sb-rule-soft)" vertical={false} />
          {hasCi && (
            <ReferenceArea
              y1={q.ciLow!}
              y2={q.ciHigh!}
              fill="var(--sb-verdigris)"
              fillOpacity={0.22}
              stroke="var(--sb-verdigris)"
              strokeOpacity={0.5}
              ifOverflow="extendDomain"
            />
          )}
          <ReferenceLine y={q.median} stroke="var(--sb-ink)" strokeWidth={2} ifOverflow="extendDomain" />
          <XAxis
            type="number"
            dataKey="t"
            domain={xDomain(data)}
            scale="time"
            tickFormatter={(t: number) => monthOf(t)}
            tickCount={4}
            {...AXIS_LOOK}
            name="Date"
          />
          <YAxis
            type="number"
            dataKey="v"
            domain={y.domain}
            ticks={y.ticks}
            tickFormatter={(v: number) => settingText(v)}
            width={52}
            {...AXIS_LOOK}
            name="Setting"
          />
          <Tooltip
            content={(props) => <PointTooltip {...props} quantity={quantity} units={units} />}
            cursor={false}
            trigger={noHover ? "click" : "hover"}
            isAnimationActive={false}
            wrapperStyle={{ zIndex: 5, outline: "none" }}
          />
          <Scatter name="Approved value" data={regular} shape={ValueDot} isAnimationActive={false} />
          <Scatter name="Flagged outlier" data={flagged} shape={OutlierMark} isAnimationActive={false} />
        </ScatterChart>
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
