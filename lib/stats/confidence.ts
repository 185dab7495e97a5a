// A plain-words confidence label for a published value, for the UI to show beside the median.
import { CONFIDENCE_TITLES, type ConfidenceLabel, type Method } from "@/lib/vocabulary";
import { MIN_VALUES_TO_JUDGE } from "./spread";
import { minimumCountForCi } from "./median-ci";
import { checkFiniteNumber, StatsInputError } from "./validate";

/**
 * How much each calibration method counts as evidence, from 0 to 1. Our own judgement (no source):
 * a clamp meter on the bench and charger-verified fly-and-recharge cycles measure the quantity
 * against an outside reference; a multimeter reading is good but usually one point; an unverified
 * value is someone's word. Keyed by the submissions.method CHECK list, so a new method must be weighed here.
 */
const METHOD_EVIDENCE_WEIGHT: Record<Method, number> = {
  bench_clamp: 1,
  fly_recharge: 1,
  multimeter: 0.6,
  unverified: 0.2,
};

/**
 * Thresholds, all inclusive. A label needs every one of its conditions; otherwise the next one down.
 *  - "too_few": n < 3 (the same cut as summarise's state).
 *  - "strong":  n ≥ 10, relative CI width ≤ 2 %, evidence score ≥ 0.75.
 *  - "fair":    n ≥ 6 (a 95 % interval exists), relative CI width ≤ 5 %, evidence score ≥ 0.5.
 *  - "weak":    anything else with n ≥ 3, including no interval or no measurable relative width.
 * Relative CI width = (ciHigh − ciLow) / |reference|, the reference normally the median.
 */
const CONFIDENCE_THRESHOLDS = {
  strong: { minCount: 10, maxRelativeWidth: 0.02, minEvidence: 0.75 },
  fair: { minCount: minimumCountForCi(), maxRelativeWidth: 0.05, minEvidence: 0.5 },
} as const;

/** One sentence per label for the UI; the thresholds above, in words. */
export const CONFIDENCE_EXPLANATIONS: Record<ConfidenceLabel, string> = {
  strong:
    "At least 10 values that agree closely (the 95 % range for the middle value is within 2 % of it), mostly measured against a clamp meter or checked over charge cycles.",
  fair: "Enough values for a 95 % range that lies within 5 % of the middle value, with reasonable evidence behind them. A good starting point; check it on your own board.",
  weak: "The values are few, spread widely, or mostly unchecked. Use the middle value only as a first guess and calibrate your own board.",
  too_few: "Fewer than 3 values so far, which is not enough to judge. Calibrate your own board, and consider sharing the result.",
};

/** Weighted share of evidence-backed methods, 0–1; null for no submissions. */
export function evidenceScore(methods: readonly Method[]): number | null {
  if (methods.length === 0) return null;
  let total = 0;
  methods.forEach((method, i) => {
    const weight = METHOD_EVIDENCE_WEIGHT[method];
    if (weight === undefined) {
      throw new StatsInputError(`methods[${i}]`, `must be one of ${Object.keys(METHOD_EVIDENCE_WEIGHT).join(", ")}`);
    }
    total += weight;
  });
  return total / methods.length;
}

/** (ciHigh − ciLow) / |reference|; null without an interval or when the reference is 0 (e.g. a zero current offset). */
export function relativeCiWidth(ciLow: number | null, ciHigh: number | null, reference: number | null): number | null {
  if (ciLow === null || ciHigh === null || reference === null || reference === 0) return null;
  return (ciHigh - ciLow) / Math.abs(reference);
}

export interface ConfidenceInput {
  n: number;
  /** From relativeCiWidth; null when there is no interval or no meaningful reference. */
  relativeCiWidth: number | null;
  /** From evidenceScore; null when there are no submissions. */
  evidenceScore: number | null;
}

export interface Confidence {
  label: ConfidenceLabel;
  title: string;
  explanation: string;
  /** What kept the label from the next one up, in plain words (empty for "strong"). */
  heldBackBy: string[];
}

function shortfalls(input: ConfidenceInput, need: { minCount: number; maxRelativeWidth: number; minEvidence: number }): string[] {
  const out: string[] = [];
  if (input.n < need.minCount) out.push(`${input.n} values; at least ${need.minCount} are needed`);
  if (input.relativeCiWidth === null) out.push("no 95 % range for the middle value yet");
  else if (input.relativeCiWidth > need.maxRelativeWidth) {
    out.push(`the 95 % range is ${(input.relativeCiWidth * 100).toFixed(1)} % of the middle value; at most ${need.maxRelativeWidth * 100} % is needed`);
  }
  if (input.evidenceScore === null || input.evidenceScore < need.minEvidence) {
    out.push("too few values were measured against a reference");
  }
  return out;
}

export function confidenceLabel(input: ConfidenceInput): Confidence {
  if (!Number.isInteger(input.n) || input.n < 0) throw new StatsInputError("n", "must be a whole number ≥ 0");
  if (input.relativeCiWidth !== null && checkFiniteNumber(input.relativeCiWidth, "relativeCiWidth") < 0) {
    throw new StatsInputError("relativeCiWidth", "must be 0 or more");
  }
  if (input.evidenceScore !== null) {
    const e = checkFiniteNumber(input.evidenceScore, "evidenceScore");
    if (e < 0 || e > 1) throw new StatsInputError("evidenceScore", "must be between 0 and 1");
  }
  const make = (label: ConfidenceLabel, heldBackBy: string[]): Confidence => ({
    label,
    title: CONFIDENCE_TITLES[label],
    explanation: CONFIDENCE_EXPLANATIONS[label],
    heldBackBy,
  });
  if (input.n < MIN_VALUES_TO_JUDGE) return make("too_few", [`${input.n} values; at least ${MIN_VALUES_TO_JUDGE} are needed`]);
  const missStrong = shortfalls(input, CONFIDENCE_THRESHOLDS.strong);
  if (missStrong.length === 0) return make("strong", []);
  const missFair = shortfalls(input, CONFIDENCE_THRESHOLDS.fair);
  return missFair.length === 0 ? make("fair", missStrong) : make("weak", missFair);
}
