// What a contribution may claim, in one place: the schema (lib/submissions/schema.ts) refuses
// anything outside these with a message saying which limit, and the evidence tables' CHECKs
// (migrations/20261205000200…400) repeat the hard ones. Each limit below names its own source.

/** A pack has 1 to 14 cells in series (the board_models.min_cells/max_cells CHECK); the board narrows it. */
export const MIN_CELLS = 1;
export const MAX_CELLS = 14;

/** Lowest LiPo cell voltage a pack can sit at: 2.5 V per cell under load (BMFA safety guidance). */
export const CELL_VOLTS_FLOOR = 2.5;
/** Highest: a full high-voltage cell, 4.35 V (vendors only: common practice). */
export const CELL_VOLTS_CEILING = 4.35;
/**
 * A display may be off by a lot before calibration: a firmware default made for an 11:1 divider
 * reads twice the truth on a 5.5:1 board. Beyond 2.5 × either way of a possible pack voltage it is
 * not a calibration error but a typo or the wrong pack (our own rule).
 */
export const REPORTED_VOLTS_SLACK = 2.5;

/**
 * Reported ÷ charged mAh, and a bench fit's gain, must lie in 0.2–5: outside it the two figures
 * cannot be the same flight or the same current, whatever the scale (our own rule).
 */
export const MIN_READING_RATIO = 0.2;
export const MAX_READING_RATIO = 5;
/** A charger cannot put back much more than a pack holds: at most 1.5 × its rating (our own rule). */
export const MAX_CHARGED_OVER_RATED = 1.5;
export const MAX_MAH = 100_000;

/** Bench points: a clamp meter on the battery lead of a multirotor, 0–1000 A; displays may read below 0. */
export const MAX_BENCH_AMPS = 1000;
export const MIN_REPORTED_AMPS = -1000;

export const MAX_READINGS = 20;
export const MAX_CYCLES = 20;
export const MIN_BENCH_POINTS = 2;
export const MAX_BENCH_POINTS = 20;

/** Same cap as the submissions.notes CHECK (and lib/content/markdown.ts NOTES_MAX_LENGTH). */
export const NOTES_MAX_LENGTH = 10_000;

/** Same rule as the submissions.firmware_version CHECK. */
export const FIRMWARE_VERSION_RE = /^[0-9A-Za-z][0-9A-Za-z.+-]{0,31}$/;

/** Possible pack voltage (V) for a cell count: [cells × 2.5, cells × 4.35]. */
export function packVoltsRange(cells: number): [number, number] {
  return [cells * CELL_VOLTS_FLOOR, cells * CELL_VOLTS_CEILING];
}
