import { SCALED_MAD_CONSTANT, TUKEY_INNER } from "@/lib/stats";
import { isOutlierSql, modifiedZSql, zScaleRuleSql } from "./modified-z-sql";

// The published aggregates, computed by PostgreSQL over approved submissions. The definitions are
// the ones lib/stats implements in TypeScript (tests hold the two to 1e-9 on the same data):
//   quartiles and median: percentile_cont, Hyndman–Fan type 7;
//   MAD: percentile_cont(0.5) of |x − median|; mean absolute deviation for the MAD = 0 rule;
//   CI: order statistics x(l), x(u) at the ranks lib/stats/median-ci.ts derives from n
//       (passed in as :ranks, so the binomial rule lives in one place);
//   outliers: the modified z-score with lib/stats/outliers.ts' substitute rules (modified-z-sql.ts,
//             the one SQL copy), and Tukey's inner fences.
// :groups is a JSON array of {r, f} pairs, or null for every group.
const VALUES = `
  SELECT s.board_revision_id AS r, s.firmware_family_id AS f, q.quantity, q.value, s.method, s.updated_at
  FROM submissions s
  CROSS JOIN LATERAL (VALUES ('voltage_scale', s.voltage_scale), ('current_scale', s.current_scale),
                             ('current_offset', s.current_offset)) AS q(quantity, value)
  WHERE s.status = 'approved' AND q.value IS NOT NULL
    AND (CAST(:groups AS jsonb) IS NULL OR (s.board_revision_id, s.firmware_family_id) IN (
          SELECT (g->>'r')::int, (g->>'f')::int FROM jsonb_array_elements(CAST(:groups AS jsonb)) AS g))`;

/** n per group and quantity: the first pass, so that the CI ranks can be looked up for each n. */
export const GROUP_COUNTS_SQL = `WITH vals AS (${VALUES}) SELECT DISTINCT count(*)::int AS n FROM vals GROUP BY r, f, quantity`;

export const AGGREGATES_SQL = `
WITH vals AS (${VALUES}),
ranks AS (SELECT * FROM jsonb_to_recordset(CAST(:ranks AS jsonb)) AS x(n int, lower int, upper int, coverage float8)),
centre AS (
  SELECT r, f, quantity, count(*)::int AS n,
         percentile_cont(0.5)  WITHIN GROUP (ORDER BY value) AS median,
         percentile_cont(0.25) WITHIN GROUP (ORDER BY value) AS q1,
         percentile_cont(0.75) WITHIN GROUP (ORDER BY value) AS q3,
         array_agg(value ORDER BY value) AS sorted,
         max(updated_at) AS last_value_at
  FROM vals GROUP BY r, f, quantity),
spread AS (
  SELECT v.r, v.f, v.quantity,
         percentile_cont(0.5) WITHIN GROUP (ORDER BY abs(v.value - c.median)) AS mad,
         avg(abs(v.value - c.median)) AS mean_abs_dev
  FROM vals v JOIN centre c USING (r, f, quantity) GROUP BY v.r, v.f, v.quantity),
judged AS (
  SELECT c.*, s.mad, s.mean_abs_dev,
         ${zScaleRuleSql({ n: "c.n", mad: "s.mad", meanAbsDev: "s.mean_abs_dev" })} AS z_scale_rule
  FROM centre c JOIN spread s USING (r, f, quantity)),
methods AS (
  SELECT r, f, quantity, jsonb_object_agg(method, k) AS method_counts
  FROM (SELECT r, f, quantity, method, count(*)::int AS k FROM vals GROUP BY r, f, quantity, method) m
  GROUP BY r, f, quantity),
flags AS (
  SELECT v.r, v.f, v.quantity,
         count(*) FILTER (WHERE ${isOutlierSql(modifiedZSql({ value: "v.value", rule: "j.z_scale_rule", median: "j.median", mad: "j.mad", meanAbsDev: "j.mean_abs_dev" }))})::int AS outlier_count,
         count(*) FILTER (WHERE j.z_scale_rule <> 'too_few' AND (
             v.value < j.q1 - ${TUKEY_INNER} * (j.q3 - j.q1) OR v.value > j.q3 + ${TUKEY_INNER} * (j.q3 - j.q1)))::int AS tukey_count
  FROM vals v JOIN judged j USING (r, f, quantity) GROUP BY v.r, v.f, v.quantity)
SELECT j.r AS "boardRevisionId", j.f AS "firmwareFamilyId", j.quantity, j.n, j.median, j.q1, j.q3,
       j.q3 - j.q1 AS iqr, j.mad, j.mad * ${SCALED_MAD_CONSTANT} AS "scaledMad", j.mean_abs_dev AS "meanAbsDev",
       j.sorted[k.lower] AS "ciLow", j.sorted[k.upper] AS "ciHigh", k.coverage AS "ciCoverage",
       k.lower AS "ciLowerRank", k.upper AS "ciUpperRank", j.z_scale_rule AS "zScaleRule",
       fl.outlier_count AS "outlierCount", fl.tukey_count AS "tukeyCount", m.method_counts AS "methodCounts",
       j.last_value_at AS "lastValueAt"
FROM judged j
JOIN flags fl USING (r, f, quantity)
JOIN methods m USING (r, f, quantity)
LEFT JOIN ranks k ON k.n = j.n`;
