// Public face of lib/stats: robust statistics for Shuntbook's published values. Pure functions,
// no database or UI; each file names the definition it implements.
export { summarise, type Summary, type SummaryState } from "./summarise";
export {
  flagPoints,
  modifiedZScore,
  zScaleRuleOf,
  describeFlags,
  tukeyFences,
  tukeyFlag,
  MODIFIED_Z_FACTOR,
  MODIFIED_Z_CUTOFF,
  MEAN_AD_FACTOR,
  TUKEY_INNER,
  TUKEY_OUTER,
  type FlaggedPoint,
  type FlagReport,
  type TukeyFences,
  type TukeyFlag,
} from "./outliers";
export { quantileType7, medianOfSorted } from "./quantile";
export { madOfSorted, meanAbsDeviationAroundMedian, SCALED_MAD_CONSTANT, SCALED_MAD_CONSTANT_EXACT } from "./mad";
export { medianCi, medianCiRanks, minimumCountForCi, DEFAULT_CI_LEVEL, type MedianCi, type MedianCiRanks } from "./median-ci";
export { binomialHalfCdf, logChoose } from "./binomial";
export { MIN_VALUES_TO_JUDGE } from "./spread";
export { recommendValue, type RecommendedValue, type StepRounding } from "./recommend";
export {
  confidenceLabel,
  evidenceScore,
  relativeCiWidth,
  CONFIDENCE_EXPLANATIONS,
  CONFIDENCE_THRESHOLDS,
  METHOD_EVIDENCE_WEIGHT,
  type Confidence,
  type ConfidenceInput,
} from "./confidence";
export { StatsInputError, MAX_ABS_VALUE, sortedCopy } from "./validate";
