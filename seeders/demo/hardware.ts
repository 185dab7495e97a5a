import { dividerRatio, revisionDividerRatio, revisionSensitivityMvPerAmp, shuntSensitivityMvPerAmp } from "@/lib/calibration/units";
import type { BoardRevision } from "@/models/Board";
import type { RevisionSpec } from "./boards";
import type { Rng } from "./random";

/** The sensor columns of board_revisions as the maker published them (null = unknown). */
export type PublishedHardware = Pick<
  BoardRevision,
  "dividerTopOhms" | "dividerBottomOhms" | "currentSensor" | "shuntMilliohms" | "amplifierGain" | "hallMvPerAmp" | "adcBits" | "adcReferenceVolts"
>;

/**
 * What the board really does, known to the scenario but not (all) to its users: the published
 * hardware where there is some, otherwise a plausible invented part. For a flight controller with
 * no current sensor of its own this is the sensor of the ESC it is usually stacked with.
 */
export type PhysicalTruth = {
  ratio: number;
  sensitivityMvPerAmp: number;
  /** sensor output at zero current, in mV: the error that the current offset corrects */
  zeroErrorMv: number;
  ratioPublished: boolean;
  sensitivityPublished: boolean;
};

/** Highest pack voltage a divider must pass at the ADC: 4.35 V per HV cell (common practice). */
const HV_CELL_VOLTS = 4.35;
/** The ADC full scale assumed for headroom checks (12-bit ADC at 3.3 V in every demo revision). */
const DEMO_ADC_REFERENCE_VOLTS = 3.3;
const DEMO_ADC_BITS = 12;

/** Smallest divider ratio that keeps a full HV pack of `cells` under the ADC reference. */
export function minimumRatioFor(cells: number): number {
  return (cells * HV_CELL_VOLTS) / DEMO_ADC_REFERENCE_VOLTS;
}

export function publishedHardware(spec: RevisionSpec): PublishedHardware {
  const s = spec.sensor;
  return {
    dividerTopOhms: spec.divider?.topOhms ?? null,
    dividerBottomOhms: spec.divider?.bottomOhms ?? null,
    currentSensor: s?.kind ?? null,
    shuntMilliohms: s?.kind === "shunt" ? s.milliohms : null,
    amplifierGain: s?.kind === "shunt" ? s.gain : null,
    hallMvPerAmp: s?.kind === "hall" ? s.mvPerAmp : null,
    adcBits: spec.adcKnown ? DEMO_ADC_BITS : null,
    adcReferenceVolts: spec.adcKnown ? DEMO_ADC_REFERENCE_VOLTS : null,
  };
}

// Parts a maker might plausibly have fitted when it did not say which: E12/E24 resistor pairs from
// ÷6.56 to ÷15.67, 0.25–1 mΩ shunts behind 20–100 V/V amplifiers, and Hall sensors of 10–40 mV/A
// (common practice, no source). physicalTruth keeps only the dividers legal for the board's cells.
const HIDDEN_DIVIDERS: ReadonlyArray<readonly [number, number]> = [
  [10_000, 1_800],
  [10_000, 1_500],
  [8_200, 1_000],
  [39_000, 3_300],
  [12_000, 1_000],
  [22_000, 1_500],
];
const HIDDEN_SHUNT_MILLIOHMS = [0.25, 0.3, 0.5, 0.75, 1] as const;
const HIDDEN_GAINS = [20, 25, 40, 50, 60, 100] as const;
const HIDDEN_HALL_MV_PER_AMP = [10, 13.3, 20, 28, 40] as const;

export function physicalTruth(hw: PublishedHardware, maxCells: number, rng: Rng): PhysicalTruth {
  const knownRatio = revisionDividerRatio(hw);
  const knownSensitivity = revisionSensitivityMvPerAmp(hw);

  let ratio = knownRatio;
  if (ratio == null) {
    const fits = HIDDEN_DIVIDERS.map(([top, bottom]) => dividerRatio(top, bottom)).filter((r) => r >= minimumRatioFor(maxCells));
    ratio = rng.pick(fits);
  }

  let sensitivity = knownSensitivity;
  if (sensitivity == null) {
    if (hw.currentSensor === "hall") {
      sensitivity = rng.pick(HIDDEN_HALL_MV_PER_AMP);
    } else {
      const milliohms = hw.shuntMilliohms ?? rng.pick(HIDDEN_SHUNT_MILLIOHMS);
      const gain = hw.amplifierGain ?? rng.pick(HIDDEN_GAINS);
      sensitivity = shuntSensitivityMvPerAmp(milliohms, gain);
    }
  }

  // A Hall sensor's zero point drifts more than an amplified shunt's (common practice, no source).
  const zeroSpreadMv = hw.currentSensor === "hall" ? 8 : 1.5;
  const zeroErrorMv = Math.round(rng.normal() * zeroSpreadMv * 10) / 10;

  return {
    ratio,
    sensitivityMvPerAmp: sensitivity,
    zeroErrorMv,
    ratioPublished: knownRatio != null,
    sensitivityPublished: knownSensitivity != null,
  };
}
