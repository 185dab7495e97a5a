import { MEAN_AD_FACTOR, MIN_VALUES_TO_JUDGE, MODIFIED_Z_CUTOFF, MODIFIED_Z_FACTOR } from "@/lib/stats";

// The modified z-score in SQL, for PostgreSQL to flag values where they are: the aggregate that
// writes board_stats and the moderation queue that orders pending submissions by their scores.
// The one SQL copy of lib/stats/outliers.ts' zScaleRuleOf and modifiedZScore, with its constants;
// tests/integration/published-stats.test.ts holds the two to 1e-9 on the same data. Arguments are
// SQL expressions (column names).

/** The z_scale_rule of a group of `n` values: 'too_few', 'mad', 'mean_abs_dev' or 'no_spread'. */
export function zScaleRuleSql(cols: { n: string; mad: string; meanAbsDev: string }): string {
  return `CASE WHEN ${cols.n} < ${MIN_VALUES_TO_JUDGE} THEN 'too_few'
              WHEN ${cols.mad} > 0 THEN 'mad' WHEN ${cols.meanAbsDev} > 0 THEN 'mean_abs_dev' ELSE 'no_spread' END`;
}

/**
 * The signed modified z-score of `value` under `rule`. NULL when the value is NULL or the rule is
 * 'too_few' (or NULL: no published figures); with no spread, 0 at the median and ±Infinity off it,
 * where the TypeScript copy reports no score and flags the value.
 */
export function modifiedZSql(cols: { value: string; rule: string; median: string; mad: string; meanAbsDev: string }): string {
  const { value, rule, median, mad, meanAbsDev } = cols;
  return `CASE ${rule}
    WHEN 'mad' THEN ${MODIFIED_Z_FACTOR} * (${value} - ${median}) / ${mad}
    WHEN 'mean_abs_dev' THEN (${value} - ${median}) / (${MEAN_AD_FACTOR} * ${meanAbsDev})
    WHEN 'no_spread' THEN CASE WHEN ${value} = ${median} THEN 0 ELSE sign(${value} - ${median}) * 'Infinity'::float8 END
    ELSE NULL END`;
}

/** Whether a score from modifiedZSql flags its value (never NULL). */
export function isOutlierSql(z: string): string {
  return `coalesce(abs(${z}) > ${MODIFIED_Z_CUTOFF}, false)`;
}
