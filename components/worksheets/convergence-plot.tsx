import type { RechargeWorksheet } from "@/lib/calibration";
import { niceAxis } from "@/components/values/axis";

// How the display's error closes in on zero, cycle by cycle, with the stop band drawn in. Each
// cycle is its own flight and recharge, so each is one mark: no line joins them. Plain SVG in a
// fixed viewBox that scales with the page: no chart library, the same drawing on server and phone.

const W = 320;
const H = 200;
const PAD = { left: 52, right: 10, top: 10, bottom: 34 };

/** "+4 %", "−12 %", "0 %": the sign always shown, with a true minus sign. */
export function signedPercent(value: number, digits = 0): string {
  const rounded = Number(value.toFixed(digits));
  if (rounded === 0) return "0 %";
  return `${rounded > 0 ? "+" : "−"}${Math.abs(rounded).toFixed(digits)} %`;
}

export function ConvergencePlot({ worksheet }: { worksheet: RechargeWorksheet }) {
  const points = worksheet.convergence.map((c) => ({ cycle: c.index + 1, error: c.errorPercent, usable: c.usable }));
  const band = worksheet.stop.tolerance * 100;
  const y = niceAxis(Math.min(-band, ...points.map((p) => p.error)), Math.max(band, ...points.map((p) => p.error)));
  const cycles = Math.max(points.length, 2);
  const plotW = W - PAD.left - PAD.right;
  const plotH = H - PAD.top - PAD.bottom;
  const xOf = (cycle: number) => PAD.left + ((cycle - 0.5) / cycles) * plotW;
  const yOf = (v: number) => PAD.top + ((y.domain[1] - v) / (y.domain[1] - y.domain[0])) * plotH;
  const summary = `Display error per cycle: ${points.map((p) => `cycle ${p.cycle} ${signedPercent(p.error, 2)}`).join(", ")}.`;

  return (
    <figure aria-labelledby="convergence-title" className="min-w-0 rounded-md border-3 border-rule bg-surface px-3 pt-3 pb-4" data-testid="convergence-plot">
      <h3 id="convergence-title" className="font-display text-lg font-bold tracking-wide uppercase">
        Convergence
      </h3>
      <svg viewBox={`0 0 ${W} ${H}`} className="mt-2 h-auto w-full max-w-xl select-none" role="img" aria-label={summary}>
        <rect x={PAD.left} y={yOf(band)} width={plotW} height={yOf(-band) - yOf(band)} fill="var(--sb-verdigris)" fillOpacity={0.18} />
        {y.ticks.map((t) => (
          <g key={t}>
            <line x1={PAD.left} x2={W - PAD.right} y1={yOf(t)} y2={yOf(t)} stroke={t === 0 ? "var(--sb-ink)" : "var(--sb-rule-soft)"} />
            <text x={PAD.left - 6} y={yOf(t)} dy="0.35em" textAnchor="end" fontSize={11} fill="var(--sb-muted)">
              {signedPercent(t)}
            </text>
          </g>
        ))}
        {points.map((p) => (
          <text key={`x${p.cycle}`} x={xOf(p.cycle)} y={H - PAD.bottom + 14} textAnchor="middle" fontSize={11} fill="var(--sb-muted)">
            {p.cycle}
          </text>
        ))}
        <text x={PAD.left + plotW / 2} y={H - 4} textAnchor="middle" fontSize={11} fill="var(--sb-muted)">
          cycle
        </text>
        <text transform={`translate(12 ${PAD.top + plotH / 2}) rotate(-90)`} textAnchor="middle" fontSize={11} fill="var(--sb-muted)">
          display error
        </text>
        {points.map((p) => (
          <circle
            key={p.cycle}
            cx={xOf(p.cycle)}
            cy={yOf(p.error)}
            r={5}
            fill={p.usable ? "var(--sb-copper)" : "var(--sb-surface)"}
            stroke="var(--sb-copper)"
            strokeWidth={2}
            data-testid="convergence-point"
          >
            <title>{`Cycle ${p.cycle}: ${signedPercent(p.error, 2)}${p.usable ? "" : " (not counted)"}`}</title>
          </circle>
        ))}
      </svg>
      <figcaption className="mt-2 text-small text-muted">
        {summary} The shaded band is the ±{band} % the worksheet stops within; a hollow mark is a cycle not counted.
      </figcaption>
    </figure>
  );
}
