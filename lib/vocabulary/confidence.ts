// How far a published value can be trusted, in one word; lib/stats/confidence.ts decides which.
const CONFIDENCE_LABELS = ["strong", "fair", "weak", "too_few"] as const;
export type ConfidenceLabel = (typeof CONFIDENCE_LABELS)[number];

export const CONFIDENCE_TITLES: Record<ConfidenceLabel, string> = {
  strong: "Strong",
  fair: "Fair",
  weak: "Weak",
  too_few: "Too few to judge",
};
