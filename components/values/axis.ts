// Round tick marks for the value axis: steps of 1, 2 or 5 × 10^k (the usual "nice numbers" rule,
// e.g. Heckbert, "Nice numbers for graph labels", Graphics Gems, 1990; from memory), never finer
// than one setting step, since settings are whole numbers.
export function niceAxis(lo: number, hi: number, target = 4): { domain: [number, number]; ticks: number[] } {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return { domain: [0, 1], ticks: [0, 1] };
  if (hi < lo) [lo, hi] = [hi, lo];
  const raw = Math.max((hi - lo) / target, 1);
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * magnitude).find((s) => s >= raw)!;
  let start = Math.floor(lo / step) * step;
  let end = Math.ceil(hi / step) * step;
  if (start === end) {
    start -= step;
    end += step;
  }
  const ticks: number[] = [];
  for (let t = start; t <= end + step / 2; t += step) ticks.push(Math.round(t * 1e9) / 1e9);
  return { domain: [start, end], ticks };
}
