// Public face of the calibration arithmetic: pure calculations, one file per method (voltage.ts,
// bench.ts for the clamp-meter method, recharge.ts for fly-and-recharge, hardware.ts with
// hardware-figures.ts and adc.ts for the divider, shunt and Hall arithmetic), over the shared pieces
// (rounding, units, evidence, least-squares, pack and chemistry, cautions, sources, fields, result).
// A worksheet page runs them as the builder types; each worksheet returns { ok, value, warnings } or
// { ok: false, errors } with field-level messages.
export { voltageWorksheet, VOLTAGE_TOLERANCE, VOLTAGE_TOLERANCE_SOURCE, type VoltageWorksheet, type VoltageWorksheetInput, type VoltagePair } from "./voltage";
export { benchWorksheet, benchPointSchema, BENCH_MIN_R_SQUARED, type BenchWorksheet, type BenchWorksheetInput, type BenchResidual } from "./bench";
export {
  rechargeWorksheet,
  STOP_TOLERANCE,
  STOP_CYCLES,
  STOP_RULE_TEXT,
  EXPECTED_MAX_CYCLES,
  CHARGED_OVER_RATED_WARNING,
  INCOMPLETE_SHORTFALL,
  STABLE_SPREAD,
  type RechargeWorksheet,
  type RechargeWorksheetInput,
  type RechargeCycleInput,
  type RechargeIteration,
} from "./recharge";
export { hardwareWorksheet, type HardwareWorksheet, type HardwareWorksheetInput, type CurrentSensorInput, type Comparison } from "./hardware";
export { adcLsbVolts, adcCountToVolts, packVoltsFromAdcCount, ADC_LSB_DEFINITION, type AdcSpec } from "./adc";
export { packWarnings, MAH_WARNING_FRACTION, RECENT_CHARGES, MIN_CHARGES_FOR_ESTIMATE, type PackWarnings, type PackWarningsInput } from "./pack";
export { CHEMISTRIES, CHEMISTRY_LIMITS, type Chemistry, type ChemistryLimits } from "./chemistry";
export {
  roundBothWays,
  predictedReadingError,
  safeRoundingSide,
  CURRENT_ROUNDING_WHY,
  VOLTAGE_ROUNDING_WHY,
  type RoundedSetting,
  type SettingRoundings,
  type SafeReading,
} from "./rounding";
export { BENCH_CAUTIONS, CHARGING_CAUTIONS, type Caution } from "./cautions";
export { SOURCES } from "./sources";
export { unwrapWorksheet, WorksheetInputError, type FieldIssue, type WorksheetResult } from "./result";
export type { WorksheetFamily } from "./fields";
