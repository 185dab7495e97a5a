// How a firmware family counts each calibrated setting: the unit, and whether a larger setting
// makes the displayed reading go up (proportional) or down (inverse).
export type VoltageScaleUnit = "V/V" | "mV/V";
export type CurrentScaleUnit = "mV/A" | "A/V";
export type CurrentOffsetUnit = "mV" | "mA";
export type Response = "proportional" | "inverse";
