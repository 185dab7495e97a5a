import { formatFigure } from "@/lib/catalogue/format";
import type { FamilyUnits, QuantityKey } from "./board-values-types";

// When may a pilot NOT borrow another revision's values? Pure rules over what the board page
// already has (each revision's sensor hardware and its published figures under one firmware
// family), so the page can warn before someone flies a v2 board on v1's current scale.
//
// A pair of revisions differs on a quantity when either
//  - the hardware says so: the divider ratio (voltage scale) or the current sensor's type or
//    sensitivity (current scale; a change of sensor type also moves the offset) differ by more than
//    HARDWARE_TOLERANCE, or
//  - the published values say so: both medians have a 95 % interval and the two intervals do not
//    overlap. Non-overlap is a conservative test: two intervals can overlap while the difference is
//    still significant, never the other way round (Schenker & Gentleman, "On judging the
//    significance of differences by examining the overlap between confidence intervals",
//    The American Statistician 55(3), 2001; from memory). So a note is never raised on noise.
//
// How a reading moves with the setting (the fly-and-recharge rule: common practice, no source):
// a "proportional" setting scales the reading up with it, an "inverse" one scales it down. At the
// same setting, board b therefore reads readingRatio × what board a reads, where
//   voltage: ratio_a / ratio_b (more division on b leaves less at the ADC pin);
//   current: sensitivity_b / sensitivity_a (more mV per amp on b looks like more current);
//   from the values: m_a / m_b for a proportional setting, m_b / m_a for an inverse one.

/** Parts that differ by less than this are the same part: common 1 % resistor tolerance (common practice, no source). */
const HARDWARE_TOLERANCE = 0.01;

/** The figures of one published quantity this rule reads; QuantityValues has them all. */
export type QuantityFigures = { n: number; median: number; ciLow: number | null; ciHigh: number | null };

/** One revision as the rule sees it: its hardware (unknown = null) and its group under the family compared. */
export type RevisionFacts = {
  label: string;
  position: number;
  dividerRatio: number | null;
  currentSensor: "shunt" | "hall" | null;
  shuntMilliohms: number | null;
  amplifierGain: number | null;
  /** Shunt × gain, or the Hall sensor's figure; null when unknown. */
  sensitivityMvPerAmp: number | null;
  /** Null when the revision has no published values under this family. */
  values: Partial<Record<QuantityKey, QuantityFigures | null>> | null;
};

/** The parts of a family's unit definition the rule needs. */
export type FamilyResponse = {
  voltageScale: Pick<FamilyUnits["voltageScale"], "response">;
  currentScale: Pick<FamilyUnits["currentScale"], "response">;
  currentOffset: Pick<FamilyUnits["currentOffset"], "unit" | "step">;
};

type HardwareChange = {
  part: "divider ratio" | "current sensor" | "shunt" | "amplifier gain" | "Hall sensor";
  /** How revision a and b have it, in words: "÷5.55", "0.5 mΩ", "a Hall sensor". */
  a: string;
  b: string;
};

export type RevisionDifference = {
  quantity: QuantityKey;
  /** The earlier revision (by position) and the later one. */
  a: string;
  b: string;
  /** The parts that differ; empty when only the values show the difference. */
  hardware: HardwareChange[];
  /** True when both 95 % intervals exist and do not overlap. */
  valuesDisagree: boolean;
  /** Scales only: what b reads at the same setting, as a multiple of what a reads; null when it cannot be told. */
  readingRatio: number | null;
  /** Offset only: b's median minus a's, in offsetUnit; null without disagreeing values. */
  offsetShift: number | null;
  offsetUnit: string | null;
  /** Whether each revision has published values of this quantity. */
  published: { a: boolean; b: boolean };
};

const SCALES = ["voltageScale", "currentScale"] as const;

function differs(x: number, y: number): boolean {
  return Math.abs(y / x - 1) > HARDWARE_TOLERANCE;
}

const SENSOR_WORDS = { shunt: "a shunt", hall: "a Hall sensor" } as const;

function dividerChanges(a: RevisionFacts, b: RevisionFacts): HardwareChange[] {
  if (a.dividerRatio === null || b.dividerRatio === null || !differs(a.dividerRatio, b.dividerRatio)) return [];
  return [{ part: "divider ratio", a: `÷${formatFigure(a.dividerRatio, 2)}`, b: `÷${formatFigure(b.dividerRatio, 2)}` }];
}

/** What changed in the current sensor, in parts a reader can find on the board. */
function sensorChanges(a: RevisionFacts, b: RevisionFacts): HardwareChange[] {
  if (a.currentSensor === null || b.currentSensor === null) return [];
  if (a.currentSensor !== b.currentSensor) {
    return [{ part: "current sensor", a: SENSOR_WORDS[a.currentSensor], b: SENSOR_WORDS[b.currentSensor] }];
  }
  // same kind of sensor: only a change in sensitivity changes the readings (a halved shunt with a
  // doubled gain reads the same, so it raises no note)
  if (a.sensitivityMvPerAmp === null || b.sensitivityMvPerAmp === null || !differs(a.sensitivityMvPerAmp, b.sensitivityMvPerAmp)) return [];
  const out: HardwareChange[] = [];
  if (a.currentSensor === "shunt") {
    if (a.shuntMilliohms !== null && b.shuntMilliohms !== null && differs(a.shuntMilliohms, b.shuntMilliohms)) {
      out.push({ part: "shunt", a: `${formatFigure(a.shuntMilliohms)} mΩ`, b: `${formatFigure(b.shuntMilliohms)} mΩ` });
    }
    if (a.amplifierGain !== null && b.amplifierGain !== null && differs(a.amplifierGain, b.amplifierGain)) {
      out.push({ part: "amplifier gain", a: `×${formatFigure(a.amplifierGain)}`, b: `×${formatFigure(b.amplifierGain)}` });
    }
  } else {
    out.push({ part: "Hall sensor", a: `${formatFigure(a.sensitivityMvPerAmp)} mV/A`, b: `${formatFigure(b.sensitivityMvPerAmp)} mV/A` });
  }
  return out;
}

function intervalsApart(x: QuantityFigures | null | undefined, y: QuantityFigures | null | undefined): boolean {
  if (!x || !y || x.ciLow === null || x.ciHigh === null || y.ciLow === null || y.ciHigh === null) return false;
  return x.ciHigh < y.ciLow || y.ciHigh < x.ciLow;
}

function hardwareRatio(quantity: (typeof SCALES)[number], a: RevisionFacts, b: RevisionFacts): number | null {
  if (quantity === "voltageScale") {
    return a.dividerRatio !== null && b.dividerRatio !== null ? a.dividerRatio / b.dividerRatio : null;
  }
  return a.sensitivityMvPerAmp !== null && b.sensitivityMvPerAmp !== null ? b.sensitivityMvPerAmp / a.sensitivityMvPerAmp : null;
}

function valuesRatio(response: "proportional" | "inverse", ma: number, mb: number): number | null {
  // a ratio of settings only means something for positive scales
  if (!(ma > 0 && mb > 0)) return null;
  return response === "proportional" ? ma / mb : mb / ma;
}

function comparePair(a: RevisionFacts, b: RevisionFacts, family: FamilyResponse): RevisionDifference[] {
  const out: RevisionDifference[] = [];
  const divider = dividerChanges(a, b);
  const sensor = sensorChanges(a, b);
  const sensorKindChanged = sensor.some((c) => c.part === "current sensor");
  const hardwareFor: Record<QuantityKey, HardwareChange[]> = {
    voltageScale: divider,
    currentScale: sensor,
    currentOffset: sensorKindChanged ? sensor : [],
  };
  for (const quantity of ["voltageScale", "currentScale", "currentOffset"] as const) {
    const qa = a.values?.[quantity] ?? null;
    const qb = b.values?.[quantity] ?? null;
    // with nothing published on either side there are no values to mix up
    if (!qa && !qb) continue;
    const hardware = hardwareFor[quantity];
    const valuesDisagree = intervalsApart(qa, qb);
    if (hardware.length === 0 && !valuesDisagree) continue;
    let readingRatio: number | null = null;
    let offsetShift: number | null = null;
    let offsetUnit: string | null = null;
    if (quantity === "currentOffset") {
      if (valuesDisagree) {
        offsetShift = (qb!.median - qa!.median) * family.currentOffset.step;
        offsetUnit = family.currentOffset.unit;
      }
    } else {
      // the parts list is physics; the values are evidence, used when the parts cannot say
      readingRatio =
        (hardware.length > 0 ? hardwareRatio(quantity, a, b) : null) ??
        (valuesDisagree ? valuesRatio(family[quantity].response, qa!.median, qb!.median) : null);
    }
    out.push({
      quantity,
      a: a.label,
      b: b.label,
      hardware,
      valuesDisagree,
      readingRatio,
      offsetShift,
      offsetUnit,
      published: { a: qa !== null, b: qb !== null },
    });
  }
  return out;
}

/**
 * Every pair of revisions (earlier first, by position) that should not share values of a quantity
 * under this family, with what shows it. Revisions keep their order; the result lists pairs in
 * order of the earlier revision, then the later, then voltage scale, current scale, current offset.
 */
export function revisionDifferences(revisions: readonly RevisionFacts[], family: FamilyResponse): RevisionDifference[] {
  const sorted = [...revisions].sort((x, y) => x.position - y.position);
  const out: RevisionDifference[] = [];
  for (let i = 0; i < sorted.length; i++) {
    for (let j = i + 1; j < sorted.length; j++) out.push(...comparePair(sorted[i], sorted[j], family));
  }
  return out;
}

const QUANTITY_WORDS: Record<QuantityKey, { name: string; reads: string }> = {
  voltageScale: { name: "voltage scale", reads: "voltage" },
  currentScale: { name: "current scale", reads: "current" },
  currentOffset: { name: "current offset", reads: "current" },
};

// Plain fractions a pilot recognises, within 5 % (our own cut-off).
const NAMED_RATIOS: ReadonlyArray<[number, string]> = [
  [1 / 4, "a quarter of"],
  [1 / 3, "a third of"],
  [1 / 2, "half"],
  [2 / 3, "two thirds of"],
  [3 / 2, "one and a half times"],
  [2, "twice"],
  [3, "three times"],
  [4, "four times"],
];

/** "reads about half the current of v1", "reads about 12 % more voltage than v1". */
export function readingPhrase(ratio: number, what: string, other: string): string {
  const named = NAMED_RATIOS.find(([r]) => Math.abs(ratio / r - 1) <= 0.05);
  if (named) return `reads about ${named[1]} the ${what} of ${other}`;
  const percent = Math.round(Math.abs(ratio - 1) * 100);
  const more = ratio > 1;
  if (percent === 0) return `reads slightly ${more ? "more" : "less"} ${what} than ${other}`;
  return `reads about ${percent} % ${more ? "more" : "less"} ${what} than ${other}`;
}

function hardwareClause(changes: HardwareChange[], mine: "a" | "b", otherLabel: string): string {
  const theirs = mine === "a" ? "b" : "a";
  return changes.map((c) => `its ${c.part} is ${c[mine]}, ${otherLabel}'s ${c[theirs]}`).join("; ");
}

/**
 * The note in plain words, told from the revision the reader is looking at (`viewing`), e.g.
 * "v2 reads about half the current of v1 at the same current scale (its shunt is 0.25 mΩ, v1's
 * 0.5 mΩ): use v2's values for a v2 board."
 */
export function describeDifference(d: RevisionDifference, viewing: string): string {
  const mine: "a" | "b" = viewing === d.a ? "a" : "b";
  const other = mine === "a" ? d.b : d.a;
  const words = QUANTITY_WORDS[d.quantity];
  const reasons: string[] = [];
  if (d.hardware.length > 0) reasons.push(hardwareClause(d.hardware, mine, other));
  if (d.valuesDisagree)
    reasons.push(d.hardware.length > 0 ? "the published values differ too" : "their published values differ by more than their spread allows");
  const because = reasons.length > 0 ? ` (${reasons.join("; ")})` : "";
  const advice = d.published[mine]
    ? `use ${viewing}'s values for a ${viewing} board.`
    : `do not use ${other}'s values on a ${viewing} board; calibrate your own.`;

  if (d.quantity === "currentOffset") {
    if (d.offsetShift !== null) {
      const shift = mine === "b" ? d.offsetShift : -d.offsetShift;
      return `${viewing}'s current offset sits about ${formatFigure(Math.abs(shift))} ${d.offsetUnit} ${shift > 0 ? "higher" : "lower"} than ${other}'s${because}: ${advice}`;
    }
    return `${viewing} has a different current sensor from ${other}${because}, so its current offset is not interchangeable: ${advice}`;
  }
  if (d.readingRatio !== null) {
    const ratio = mine === "b" ? d.readingRatio : 1 / d.readingRatio;
    return `${viewing} ${readingPhrase(ratio, words.reads, other)} at the same ${words.name}${because}: ${advice}`;
  }
  return `${viewing}'s ${words.name} is not interchangeable with ${other}'s${because}: ${advice}`;
}
