import { niceAxis } from "@/components/values/axis";
import { formatFigure } from "@/lib/catalogue/format";

// One quantity's approved values on a numbered axis, each value its own dot (a beeswarm: a dot that
// would cover another moves up or down just far enough, so every value stays visible), the median
// a dashed line, and the submission under review in a lane of its own above them, so it never hides
// a value and is never hidden. A submission far outside the approved values sits at the edge with
// an arrow and its number instead of squeezing the others into one stack. Plain SVG in a viewBox
// that scales with its box, like the worksheets' convergence plot: no chart library.

const W = 360;
const PAD = { left: 14, right: 14, top: 8 };
const LANE = 30; // the submission's lane, above the swarm
const AXIS = 30; // ticks and their numbers below the swarm
const GAP = 1; // space between touching dots

export type StripPoint = { value: number; unverified: boolean };

/**
 * Vertical offsets for dots at x positions `xs` (any order) so no two overlap: each dot, left to
 * right, takes the offset nearest the middle line that clears every dot already placed.
 */
export function beeswarm(xs: readonly number[], r: number): number[] {
  const d = 2 * r + GAP;
  const order = xs.map((x, i) => ({ x, i })).sort((a, b) => a.x - b.x || a.i - b.i);
  const placed: { x: number; y: number }[] = [];
  const ys = new Array<number>(xs.length).fill(0);
  for (const { x, i } of order) {
    const blocked = placed
      .filter((p) => Math.abs(p.x - x) < d)
      .map((p) => {
        const h = Math.sqrt(d * d - (p.x - x) ** 2);
        return [p.y - h, p.y + h] as const;
      });
    const candidates = [0, ...blocked.flatMap(([lo, hi]) => [lo, hi])].sort((a, b) => Math.abs(a) - Math.abs(b) || a - b);
    const y = candidates.find((c) => blocked.every(([lo, hi]) => c <= lo + 1e-9 || c >= hi - 1e-9)) ?? 0;
    ys[i] = y;
    placed.push({ x, y });
  }
  return ys;
}

function layout(points: readonly StripPoint[], xOf: (v: number) => number) {
  for (const r of [4, 3, 2.5]) {
    const ys = beeswarm(
      points.map((p) => xOf(p.value)),
      r,
    );
    const half = Math.max(0, ...ys.map(Math.abs)) + r + 2;
    if (half <= 70 || r === 2.5) return { r, ys, half };
  }
  throw new Error("unreachable");
}

export function StripPlot({
  title,
  points,
  median,
  highlight,
}: {
  /** Names the quantity for assistive technology ("Current scale"). */
  title: string;
  /** The group's approved values. */
  points: readonly StripPoint[];
  median: number | null;
  /** The submission's value, drawn apart; null when it leaves this quantity out. */
  highlight: number | null;
}) {
  if (points.length === 0) return null;
  const values = points.map((p) => p.value);
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const span = Math.max(hi - lo, Math.abs(median ?? lo) * 0.02, 1);
  // far outside the approved values (more than eight times their span beyond them, which would squeeze
  // them into one stack): at the edge, with an arrow and its number
  const offScale = highlight !== null && (highlight < lo - 8 * span || highlight > hi + 8 * span);
  const shown = highlight !== null && !offScale ? [...values, highlight] : values;
  const axis = niceAxis(Math.min(...shown), Math.max(...shown));
  const [d0, d1] = axis.domain;
  const plotW = W - PAD.left - PAD.right;
  const xOf = (v: number) => PAD.left + ((v - d0) / (d1 - d0)) * plotW;
  const { r, ys, half } = layout(points, xOf);
  const mid = PAD.top + LANE + half;
  const axisY = mid + half;
  const H = axisY + AXIS;
  const hx = highlight === null ? null : offScale ? (highlight > hi ? W - PAD.right : PAD.left) : xOf(highlight);
  const label =
    `${title}: ${points.length} approved value${points.length === 1 ? "" : "s"} from ${formatFigure(lo)} to ${formatFigure(hi)}` +
    (median !== null ? `, median ${formatFigure(median)}` : "") +
    (highlight !== null ? `; this submission ${formatFigure(highlight)}${offScale ? ", far beyond them" : ""}.` : ".");

  return (
    <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full max-w-xl select-none" role="img" aria-label={label} data-testid="strip-plot">
      <line x1={PAD.left} x2={W - PAD.right} y1={axisY} y2={axisY} stroke="var(--sb-ink)" />
      {axis.ticks.map((t) => (
        <g key={t}>
          <line x1={xOf(t)} x2={xOf(t)} y1={axisY} y2={axisY + 5} stroke="var(--sb-ink)" />
          <text x={xOf(t)} y={axisY + 18} textAnchor="middle" fontSize={11} fill="var(--sb-muted)" data-testid="strip-tick">
            {formatFigure(t)}
          </text>
        </g>
      ))}
      {median !== null && (
        <line x1={xOf(median)} x2={xOf(median)} y1={mid - half} y2={axisY} stroke="var(--sb-verdigris)" strokeWidth={2} strokeDasharray="4 3" />
      )}
      {points.map((p, i) => (
        <circle
          key={i}
          cx={xOf(p.value)}
          cy={mid + ys[i]}
          r={r}
          fill={p.unverified ? "var(--sb-surface)" : "var(--sb-copper)"}
          stroke="var(--sb-copper)"
          strokeWidth={1.5}
          data-testid="strip-dot"
        >
          <title>{`${formatFigure(p.value)}${p.unverified ? " (unverified)" : ""}`}</title>
        </circle>
      ))}
      {highlight !== null && hx !== null && (
        <g data-testid="strip-highlight">
          {!offScale && <line x1={hx} x2={hx} y1={PAD.top + LANE - 6} y2={axisY} stroke="var(--sb-fault)" strokeWidth={1.5} strokeOpacity={0.6} />}
          <path d={`M${hx},${PAD.top + LANE - 14}l7,7l-7,7l-7,-7z`} fill="var(--sb-fault)" />
          <text x={hx} y={PAD.top + 10} textAnchor={hx > W - 60 ? "end" : hx < 60 ? "start" : "middle"} fontSize={11} fontWeight="bold" fill="var(--sb-fault)">
            {offScale
              ? highlight > hi
                ? `this one: ${formatFigure(highlight)} →`
                : `← this one: ${formatFigure(highlight)}`
              : `this one: ${formatFigure(highlight)}`}
          </text>
        </g>
      )}
    </svg>
  );
}
