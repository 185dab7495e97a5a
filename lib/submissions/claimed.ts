import type { Method, SensingSource } from "@/lib/vocabulary";

// What a contributor claims and how they read it: the same seven fields wherever a stored
// submission is shown (its view) or replayed as a request body (the demo's evidence verdicts).

export type ClaimedValues = {
  firmwareVersion: string;
  sensingSource: SensingSource;
  method: Method;
  voltageScale: number | null;
  currentScale: number | null;
  currentOffset: number | null;
  notes: string | null;
};

/** The claimed values of a submission-like row, copied field by field (nothing else comes along). */
export function claimedValues(s: ClaimedValues): ClaimedValues {
  return {
    firmwareVersion: s.firmwareVersion,
    sensingSource: s.sensingSource,
    method: s.method,
    voltageScale: s.voltageScale,
    currentScale: s.currentScale,
    currentOffset: s.currentOffset,
    notes: s.notes,
  };
}
