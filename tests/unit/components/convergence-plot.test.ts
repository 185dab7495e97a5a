import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { createElement } from "react";
import { ConvergencePlot, signedPercent } from "@/components/worksheets/convergence-plot";
import type { RechargeWorksheet } from "@/lib/calibration";

// The daily-paths issue: the convergence plot labelled −12 % as "12 %" and joined separate cycles
// with a curve. Ticks carry their sign (a true minus, U+2212, the typographic convention; common
// practice, no source) and each cycle is one mark.

describe("convergence plot", () => {
  it("signs its percentages", () => {
    expect([signedPercent(-12), signedPercent(4), signedPercent(0), signedPercent(-0.004, 2), signedPercent(-1.234, 2)]).toEqual([
      "−12 %",
      "+4 %",
      "0 %",
      "0 %",
      "−1.23 %",
    ]);
  });

  it("draws one mark per cycle, no joining line, signed ticks and both axis labels", () => {
    const worksheet = {
      stop: { tolerance: 0.01 },
      convergence: [
        { index: 0, scale: 400, ratio: 0.88, errorPercent: -12, usable: true },
        { index: 1, scale: 352, ratio: 1.004, errorPercent: 0.4, usable: true },
      ],
    } as unknown as RechargeWorksheet;
    const svg = renderToStaticMarkup(createElement(ConvergencePlot, { worksheet }));
    expect(svg.match(/data-testid="convergence-point"/g)).toHaveLength(2);
    expect(svg).not.toMatch(/<path|<polyline/);
    expect(svg).toContain(">−10 %<"); // a tick: niceAxis over −12…+1 steps by 5
    expect(svg).toContain("cycle 1 −12.00 %");
    expect(svg).toContain(">display error<");
    expect(svg).toContain(">cycle<");
  });
});
