// How far a published value can be trusted, in one word; lib/stats/confidence.ts decides which.
export type ConfidenceLabel = "strong" | "fair" | "weak" | "too_few";

export const CONFIDENCE_TITLES: Record<ConfidenceLabel, string> = {
  strong: "Strong",
  fair: "Fair",
  weak: "Weak",
  too_few: "Too few to judge",
};
