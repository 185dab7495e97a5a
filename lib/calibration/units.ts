import type { BoardRevision } from "@/models/Board";
import type { FirmwareFamily } from "@/models/FirmwareFamily";

// Conversions between a board's physical sensor hardware and a firmware family's setting units.
// A setting is a count of the family's step (the firmware stores integers); these functions return
// the exact, unrounded count so that callers decide how to round (see roundSetting).
//
// Meaning of the units (migrations/20261202000600-create-firmware-families.ts):
//   voltage 'V/V'  : divider ratio (pack volts per ADC-pin volt)     -> setting = ratio / step
//   voltage 'mV/V' : millivolts at the ADC pin per pack volt          -> setting = (1000 / ratio) / step
//   current 'mV/A' : sensor output millivolts per amp (sensitivity)  -> setting = sensitivity / step
//   current 'A/V'  : amps per volt of sensor output                  -> setting = (1000 / sensitivity) / step

/** Only the family columns the voltage conversion reads, so tests can pass plain objects. */
export type VoltageUnits = Pick<FirmwareFamily, "voltageScaleUnit" | "voltageScaleStep">;
/** Only the family columns the current conversion reads. */
export type CurrentUnits = Pick<FirmwareFamily, "currentScaleUnit" | "currentScaleStep">;
/** The revision columns that describe the voltage divider. */
export type DividerHardware = Pick<BoardRevision, "dividerTopOhms" | "dividerBottomOhms">;
/** The revision columns that describe the current sensor. */
export type CurrentSensorHardware = Pick<BoardRevision, "currentSensor" | "shuntMilliohms" | "amplifierGain" | "hallMvPerAmp">;

/** A bad input to a conversion, naming the field so that a form can show it beside the input. */
export class UnitConversionError extends RangeError {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(`${field}: ${message}`);
    this.name = "UnitConversionError";
  }
}

function requirePositive(field: string, value: number): number {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0) {
    throw new UnitConversionError(field, `must be a positive finite number (got ${String(value)})`);
  }
  return value;
}

/**
 * Divider ratio Vin / Vout of a resistor divider (pack+ -> top -> ADC pin -> bottom -> ground).
 * From Vout = Vin · R2 / (R1 + R2) (voltage divider formula): ratio = (R1 + R2) / R2.
 * A 10 k / 1 k pair therefore divides by 11, not 10.
 */
export function dividerRatio(topOhms: number, bottomOhms: number): number {
  requirePositive("dividerTopOhms", topOhms);
  requirePositive("dividerBottomOhms", bottomOhms);
  return (topOhms + bottomOhms) / bottomOhms;
}

/** The divider ratio of a revision, or null when its resistors are not known. */
export function revisionDividerRatio(hw: DividerHardware): number | null {
  if (hw.dividerTopOhms == null || hw.dividerBottomOhms == null) return null;
  return dividerRatio(hw.dividerTopOhms, hw.dividerBottomOhms);
}

/** Voltage scale setting (in steps) for a divider ratio, in the family's unit. */
export function voltageScaleSettingFromRatio(ratio: number, family: VoltageUnits): number {
  requirePositive("dividerRatio", ratio);
  const step = requirePositive("voltageScaleStep", family.voltageScaleStep);
  switch (family.voltageScaleUnit) {
    case "V/V":
      return ratio / step;
    case "mV/V":
      return 1000 / ratio / step;
    default:
      throw new UnitConversionError("voltageScaleUnit", `unknown unit ${JSON.stringify(family.voltageScaleUnit)}`);
  }
}

/** Divider ratio that a voltage scale setting (in steps) stands for: the inverse of the above. */
export function ratioFromVoltageScaleSetting(setting: number, family: VoltageUnits): number {
  requirePositive("voltageScale", setting);
  const step = requirePositive("voltageScaleStep", family.voltageScaleStep);
  switch (family.voltageScaleUnit) {
    case "V/V":
      return setting * step;
    case "mV/V":
      return 1000 / (setting * step);
    default:
      throw new UnitConversionError("voltageScaleUnit", `unknown unit ${JSON.stringify(family.voltageScaleUnit)}`);
  }
}

/**
 * Sensitivity in mV/A of a shunt read through an amplifier. Ohm's law: the shunt drops
 * R (mΩ) × I (A) = mV per amp, and the amplifier multiplies that by its gain (V/V).
 */
export function shuntSensitivityMvPerAmp(shuntMilliohms: number, amplifierGain: number): number {
  requirePositive("shuntMilliohms", shuntMilliohms);
  requirePositive("amplifierGain", amplifierGain);
  return shuntMilliohms * amplifierGain;
}

/**
 * Sensitivity in mV/A of a revision's current sensor, or null when the sensor or part of it is
 * unknown. A Hall sensor's datasheet figure is already in mV/A.
 */
export function revisionSensitivityMvPerAmp(hw: CurrentSensorHardware): number | null {
  if (hw.currentSensor === "shunt") {
    if (hw.shuntMilliohms == null || hw.amplifierGain == null) return null;
    return shuntSensitivityMvPerAmp(hw.shuntMilliohms, hw.amplifierGain);
  }
  if (hw.currentSensor === "hall") {
    if (hw.hallMvPerAmp == null) return null;
    return requirePositive("hallMvPerAmp", hw.hallMvPerAmp);
  }
  return null;
}

/** Current scale setting (in steps) for a sensor sensitivity in mV/A, in the family's unit. */
export function currentScaleSettingFromSensitivity(sensitivityMvPerAmp: number, family: CurrentUnits): number {
  requirePositive("sensitivityMvPerAmp", sensitivityMvPerAmp);
  const step = requirePositive("currentScaleStep", family.currentScaleStep);
  switch (family.currentScaleUnit) {
    case "mV/A":
      return sensitivityMvPerAmp / step;
    case "A/V":
      return 1000 / sensitivityMvPerAmp / step;
    default:
      throw new UnitConversionError("currentScaleUnit", `unknown unit ${JSON.stringify(family.currentScaleUnit)}`);
  }
}

/** Sensor sensitivity in mV/A that a current scale setting (in steps) stands for. */
export function sensitivityFromCurrentScaleSetting(setting: number, family: CurrentUnits): number {
  requirePositive("currentScale", setting);
  const step = requirePositive("currentScaleStep", family.currentScaleStep);
  switch (family.currentScaleUnit) {
    case "mV/A":
      return setting * step;
    case "A/V":
      return 1000 / (setting * step);
    default:
      throw new UnitConversionError("currentScaleUnit", `unknown unit ${JSON.stringify(family.currentScaleUnit)}`);
  }
}

/** Settings are whole steps in the firmware; this rounds half away from zero, symmetric for offsets. */
export function roundSetting(value: number): number {
  if (!Number.isFinite(value)) throw new UnitConversionError("setting", `must be a finite number (got ${String(value)})`);
  const rounded = Math.sign(value) * Math.round(Math.abs(value));
  return rounded === 0 ? 0 : rounded; // no -0
}
