// Public face of the calibration arithmetic: pure calculations, one file per method (voltage.ts,
// bench.ts for the clamp-meter method, recharge.ts for fly-and-recharge, hardware.ts with
// hardware-figures.ts and adc.ts for the divider, shunt and Hall arithmetic), over the shared pieces
// (rounding, units, evidence, least-squares, pack and chemistry, cautions, sources, fields, result).
// A worksheet page runs them as the builder types; each worksheet returns { ok, value, warnings } or
// { ok: false, errors } with field-level messages.
export { voltageWorksheet, VOLTAGE_TOLERANCE, type VoltageWorksheet } from "./voltage";
export { benchWorksheet, benchPointSchema, BENCH_MIN_R_SQUARED, type BenchWorksheet } from "./bench";
export {
  rechargeWorksheet,
  STOP_TOLERANCE,
  EXPECTED_MAX_CYCLES,
  CHARGED_OVER_RATED_WARNING,
  type RechargeWorksheet,
  type RechargeCycleInput,
} from "./recharge";
export { hardwareWorksheet, type HardwareWorksheet } from "./hardware";
export { adcLsbVolts, adcCountToVolts, packVoltsFromAdcCount } from "./adc";
export { packLandingGuide, USED_CAPACITY_ALERT_FRACTION, type PackLandingGuide } from "./pack";
export { CHEMISTRY_LIMITS } from "./chemistry";
export { roundBothWays, predictedReadingError, safeRoundingSide, CURRENT_ROUNDING_WHY, VOLTAGE_ROUNDING_WHY, type RoundedSetting } from "./rounding";

export { unwrapWorksheet, WorksheetInputError, type FieldIssue } from "./result";
export type { WorksheetFamily } from "./fields";
