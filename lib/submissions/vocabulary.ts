import type { Method, SensingSource, SubmissionStatus } from "@/models/Submission";

// The words of a contribution, safe to import in the browser: the models import Sequelize, so the
// form cannot take these lists from there; models/Submission.ts takes them from here instead.

export const METHODS = ["multimeter", "bench_clamp", "fly_recharge", "unverified"] as const;
export const SENSING_SOURCES = ["board_adc", "esc_telemetry", "power_module", "estimate"] as const;
/** Where the multimeter touched the pack; both read the whole pack voltage. */
export const MEASURED_AT = ["main_lead", "balance_outer_pins"] as const;
export type MeasuredAt = (typeof MEASURED_AT)[number];

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

export type { Method, SensingSource, SubmissionStatus } from "@/models/Submission";
