// Which spread a value's modified z-score was divided by (lib/stats/outliers.ts says when each
// applies); board_stats.z_scale_rule keeps the same words.
export type ZScaleRule = "mad" | "mean_abs_dev" | "no_spread" | "too_few";
