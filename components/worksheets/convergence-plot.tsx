"use client";

import { CartesianGrid, Line, LineChart, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import type { RechargeWorksheet } from "@/lib/calibration";

// How the display's error closes in on zero, cycle by cycle, with the stop band (±1 %) drawn in.
export function ConvergencePlot({ worksheet }: { worksheet: RechargeWorksheet }) {
  const data = worksheet.convergence.map((c) => ({ cycle: c.index + 1, error: Number(c.errorPercent.toFixed(2)), scale: c.scale }));
  const band = worksheet.stop.tolerance * 100;
  const summary = `Display error per cycle: ${data.map((d) => `cycle ${d.cycle} ${d.error} %`).join(", ")}.`;
  return (
    <figure aria-labelledby="convergence-title" className="min-w-0 rounded-md border-3 border-rule bg-surface px-3 pt-3 pb-4" data-testid="convergence-plot">
      <h3 id="convergence-title" className="font-display text-lg font-bold tracking-wide uppercase">
        Convergence
      </h3>
      <div className="mt-2 h-56 w-full select-none">
        <LineChart
          responsive
          style={{ width: "100%", height: "100%" }}
          data={data}
          margin={{ top: 8, right: 12, bottom: 0, left: 0 }}
          role="img"
          aria-label={summary}
        >
          <CartesianGrid stroke="var(--sb-rule-soft)" vertical={false} />
          <ReferenceLine y={band} stroke="var(--sb-verdigris)" strokeDasharray="4 3" />
          <ReferenceLine y={-band} stroke="var(--sb-verdigris)" strokeDasharray="4 3" />
          <ReferenceLine y={0} stroke="var(--sb-ink)" />
          <XAxis
            dataKey="cycle"
            stroke="var(--sb-rule)"
            tick={{ fill: "var(--sb-muted)" }}
            allowDecimals={false}
            label={{ value: "cycle", position: "insideBottomRight", offset: -2, fill: "var(--sb-muted)" }}
          />
          <YAxis stroke="var(--sb-rule)" tick={{ fill: "var(--sb-muted)" }} width={44} unit=" %" />
          <Tooltip formatter={(v) => [`${v} %`, "display error"]} labelFormatter={(l) => `Cycle ${l}`} />
          <Line
            type="monotone"
            dataKey="error"
            stroke="var(--sb-copper)"
            strokeWidth={2.5}
            dot={{ r: 4, fill: "var(--sb-copper)" }}
            isAnimationActive={false}
          />
        </LineChart>
      </div>
      <figcaption className="mt-2 text-small text-muted">
        {summary} The dashed lines are the ±{band} % stop band.
      </figcaption>
    </figure>
  );
}
