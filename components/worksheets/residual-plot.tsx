import { formatFigure } from "@/lib/catalogue/format";
import type { BenchWorksheet } from "@/lib/calibration";

// Display minus fitted current at each clamp-meter point: a linear sensor read at steady throttle
// scatters evenly round zero, and one odd point stands out. Plain SVG, symmetric about zero.

const W = 320;
const H = 170;
const PAD = { left: 58, right: 12, top: 8, bottom: 30 };

export function ResidualPlot({ residuals }: { residuals: BenchWorksheet["residuals"] }) {
  const reach = Math.max(0.05, ...residuals.map((r) => Math.abs(r.residualAmps))) * 1.2;
  const xs = residuals.map((r) => r.measuredAmps);
  const [lo, hi] = [Math.min(0, ...xs), Math.max(...xs, 1)];
  const plotW = W - PAD.left - PAD.right;
  const plotH = H - PAD.top - PAD.bottom;
  const xOf = (a: number) => PAD.left + ((a - lo) / (hi - lo)) * plotW;
  const yOf = (r: number) => PAD.top + ((reach - r) / (2 * reach)) * plotH;
  const amps = (a: number, digits: number) => `${a > 0 ? "+" : a < 0 ? "−" : ""}${formatFigure(Math.abs(a), digits)} A`;
  return (
    <figure className="w-full max-w-xl select-none" data-testid="residual-plot">
      <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full" role="img" aria-label="Residuals: display minus fitted current at each point">
        {[reach, 0, -reach].map((t) => (
          <g key={t}>
            <line x1={PAD.left} x2={W - PAD.right} y1={yOf(t)} y2={yOf(t)} stroke={t === 0 ? "var(--sb-ink)" : "var(--sb-rule-soft)"} />
            <text x={PAD.left - 6} y={yOf(t)} dy="0.35em" textAnchor="end" fontSize={11} fill="var(--sb-muted)">
              {amps(t, 2)}
            </text>
          </g>
        ))}
        {[lo, (lo + hi) / 2, hi].map((a) => (
          <text key={a} x={xOf(a)} y={H - 14} textAnchor="middle" fontSize={11} fill="var(--sb-muted)">
            {formatFigure(a, 0)} A
          </text>
        ))}
        <text x={PAD.left + plotW / 2} y={H - 2} textAnchor="middle" fontSize={11} fill="var(--sb-muted)">
          clamp meter
        </text>
        {residuals.map((r) => (
          <circle key={r.index} cx={xOf(r.measuredAmps)} cy={yOf(r.residualAmps)} r={4.5} fill="var(--sb-copper)">
            <title>{`${formatFigure(r.measuredAmps, 1)} A: ${amps(r.residualAmps, 3)} from the line`}</title>
          </circle>
        ))}
      </svg>
      <figcaption className="text-small text-muted">
        Display minus the fitted line at each point; an even scatter round zero is what a steady reading gives.
      </figcaption>
    </figure>
  );
}
