import { linearRegression, sampleCorrelation } from "simple-statistics";

// Ordinary least squares of y on x (minimising the squared vertical distances), from
// simple-statistics rather than code of our own. This file only adds what a bench fit needs around
// it: a clear refusal when the points cannot define a line, and the correlation beside the line.

export type LineFit = {
  /** dy/dx of the fitted line y = slope·x + intercept. */
  slope: number;
  intercept: number;
  /** Pearson's sample correlation of x and y; null when y does not vary (a flat line fits exactly). */
  r: number | null;
  n: number;
};

/** A set of points no line can be fitted through, naming why so a form can say it. */
export class LineFitError extends RangeError {
  constructor(message: string) {
    super(message);
    this.name = "LineFitError";
  }
}

const spread = (values: readonly number[]) => Math.max(...values) - Math.min(...values);

/** y = slope·x + intercept by least squares, over [x, y] pairs. Throws LineFitError below 2 distinct x. */
export function fitLine(points: ReadonlyArray<readonly [number, number]>): LineFit {
  if (points.length < 2) throw new LineFitError(`A line needs at least 2 points; got ${points.length}.`);
  for (const [x, y] of points) {
    if (!Number.isFinite(x) || !Number.isFinite(y)) throw new LineFitError("Every point needs two finite numbers.");
  }
  const xs = points.map(([x]) => x);
  const ys = points.map(([, y]) => y);
  // with every x equal the slope is 0/0: simple-statistics returns NaN, we say what is wrong
  if (spread(xs) === 0) throw new LineFitError("The points all share one x value, so no slope can be fitted: take them at different currents.");
  const { m, b } = linearRegression(points.map(([x, y]) => [x, y]));
  const r = spread(ys) === 0 ? null : sampleCorrelation(xs, ys);
  return { slope: m, intercept: b, r, n: points.length };
}
