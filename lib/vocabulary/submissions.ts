// The words of a contribution: how it was measured, what sensed the current, where the meter
// touched the pack, and where it stands in review. The migrations' CHECK constraints spell the
// same words; the browser imports these lists, so this file imports nothing.

export const METHODS = ["multimeter", "bench_clamp", "fly_recharge", "unverified"] as const;
export type Method = (typeof METHODS)[number];

export const SENSING_SOURCES = ["board_adc", "esc_telemetry", "power_module", "estimate"] as const;
export type SensingSource = (typeof SENSING_SOURCES)[number];

/** Where the multimeter touched the pack; both read the whole pack voltage. */
export const MEASURED_AT = ["main_lead", "balance_outer_pins"] as const;
export type MeasuredAt = (typeof MEASURED_AT)[number];

export const STATUSES = ["pending", "approved", "rejected", "changes_requested"] as const;
export type SubmissionStatus = (typeof STATUSES)[number];

export const METHOD_LABELS: Record<Method, string> = {
  multimeter: "Multimeter voltage check",
  bench_clamp: "Bench test with a DC clamp meter",
  fly_recharge: "Fly and recharge",
  unverified: "Not measured (unverified)",
};

export const METHOD_HINTS: Record<Method, string> = {
  multimeter: "Compare the displayed pack voltage with a multimeter on the same pack.",
  bench_clamp: "Compare the displayed current with a clamp meter on the battery lead at two or more loads.",
  fly_recharge: "Compare the mAh the display says you used with the mAh the charger puts back.",
  unverified: "Values you use or were given, not checked against a meter or charger.",
};

export const SENSING_SOURCE_LABELS: Record<SensingSource, string> = {
  board_adc: "The board's own sensor (ADC)",
  esc_telemetry: "ESC telemetry",
  power_module: "External power module",
  estimate: "Estimate only (no current sensor)",
};

export const MEASURED_AT_LABELS: Record<MeasuredAt, string> = {
  main_lead: "Main battery lead",
  balance_outer_pins: "Balance plug, outer pins",
};

export const STATUS_LABELS: Record<SubmissionStatus, string> = {
  pending: "Pending review",
  approved: "Approved",
  rejected: "Rejected",
  changes_requested: "Changes requested",
};

/** A contributor may edit a submission only while a moderator has not decided it. */
export const EDITABLE_STATUSES: readonly SubmissionStatus[] = ["pending", "changes_requested"];
