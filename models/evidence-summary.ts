import type { Quantity } from "@/lib/vocabulary";

// The shape of `submissions.evidence_summary` (a JSONB column): what a contribution's evidence
// implies and how each claimed value compares with it. It lives here, beside the model that stores
// it, so that models/ need not import lib/; lib/calibration/evidence.ts computes it.

export type EvidenceQuantity = Quantity;
export type EvidenceSource = "voltage_check" | "recharge_cycles" | "bench_points";

export type BenchImplication = {
  /** Fitted reported amps per measured amp: 1 when the scale is right. */
  gain: number;
  /** Fitted reported amps at zero measured current: 0 when the offset is right. */
  interceptAmps: number;
  r: number | null;
  n: number;
  impliedScale: number;
  impliedOffset: number;
};

export type EvidenceCheck = {
  quantity: EvidenceQuantity;
  source: EvidenceSource;
  claimed: number;
  implied: number;
  /** claimed − implied, in steps. */
  difference: number;
  /** (claimed − implied) ÷ |implied|; null when the implied value is 0. */
  relativeDifference: number | null;
  /** The largest |difference| in steps that is not flagged. */
  allowed: number;
  mismatch: boolean;
};

export type EvidenceSummary = {
  tolerance: number;
  /** The offset check's floor in steps (offsetFloorSteps in lib/calibration/evidence.ts), or the bare 10 steps without bench evidence. */
  offsetToleranceFloorSteps: number;
  voltage: { implied: number; perReading: number[] } | null;
  cycles: { implied: number; perCycle: number[] } | null;
  bench: BenchImplication | null;
  checks: EvidenceCheck[];
  mismatch: boolean;
};
