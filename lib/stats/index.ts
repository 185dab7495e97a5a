// Public face of lib/stats: robust statistics for Shuntbook's published values. Pure functions,
// no database or UI; each file names the definition it implements.
export { summarise } from "./summarise";
export {
  flagPoints,
  modifiedZScore,
  zScaleRuleOf,
  describeFlags,
  spreadMultiple,
  tukeyFences,
  MODIFIED_Z_FACTOR,
  MODIFIED_Z_CUTOFF,
  MEAN_AD_FACTOR,
  TUKEY_INNER,
} from "./outliers";
export { quantileType7, medianOfSorted } from "./quantile";
export { madOfSorted, meanAbsDeviationAroundMedian, SCALED_MAD_CONSTANT } from "./mad";
export { medianCi, medianCiRanks, minimumCountForCi } from "./median-ci";
export { binomialHalfCdf } from "./binomial";
export { MIN_VALUES_TO_JUDGE } from "./spread";
export { recommendValue } from "./recommend";
export { confidenceLabel, evidenceScore, relativeCiWidth, CONFIDENCE_EXPLANATIONS } from "./confidence";
export { StatsInputError, MAX_ABS_VALUE, sortedCopy } from "./validate";
