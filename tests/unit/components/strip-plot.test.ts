import { describe, expect, it } from "vitest";
import { beeswarm } from "@/components/moderation/strip-plot";

// The review's strip plot keeps every approved value visible (issue 13): the beeswarm moves a dot
// that would cover another just far enough up or down. Checked by geometry alone: no two dot
// centres closer than a diameter (common practice, no source).
describe("beeswarm", () => {
  const r = 4;
  const overlaps = (xs: number[], ys: number[]) => {
    const bad: [number, number][] = [];
    for (let i = 0; i < xs.length; i++) for (let j = i + 1; j < xs.length; j++) if (Math.hypot(xs[i] - xs[j], ys[i] - ys[j]) < 2 * r - 1e-6) bad.push([i, j]);
    return bad;
  };

  it("leaves spread-out values on the middle line", () => {
    expect(beeswarm([10, 40, 80, 200], r)).toEqual([0, 0, 0, 0]);
  });

  it("never lets two dots overlap, even thirty on one spot or a dense cluster", () => {
    const same = Array.from({ length: 30 }, () => 100);
    expect(overlaps(same, beeswarm(same, r))).toEqual([]);
    const cluster = Array.from({ length: 40 }, (_, i) => 100 + ((i * 37) % 23) * 0.7);
    const ys = beeswarm(cluster, r);
    expect(overlaps(cluster, ys)).toEqual([]);
    // nearest the middle first: the stack grows both ways, not in one tall column
    expect(Math.max(...ys)).toBeGreaterThan(0);
    expect(Math.min(...ys)).toBeLessThan(0);
  });
});
