import { formatFigure } from "@/lib/catalogue/format";
import {
  currentScaleSettingFromSensitivity,
  ratioFromVoltageScaleSetting,
  roundSetting,
  sensitivityFromCurrentScaleSetting,
  voltageScaleSettingFromRatio,
} from "@/lib/calibration/units";
import type { FamilyUnits, QuantityKey } from "@/lib/published/board-values-types";

// What a setting stands for physically, in a family's units: the words under the big number.
// The conversions are lib/calibration/units.ts'; this file only words them.

export const QUANTITY_TITLES: Record<QuantityKey, string> = {
  voltageScale: "Voltage scale",
  currentScale: "Current scale",
  currentOffset: "Current offset",
};

/** The hardware figures a revision's parts list gives, when known. */
export type PartsFigures = { dividerRatio: number | null; sensitivityMvPerAmp: number | null };

const voltageUnits = (u: FamilyUnits) => ({ voltageScaleUnit: u.voltageScale.unit, voltageScaleStep: u.voltageScale.step });
const currentUnits = (u: FamilyUnits) => ({ currentScaleUnit: u.currentScale.unit, currentScaleStep: u.currentScale.step });

/** A setting as the pilot types it: ASCII minus, no grouping, so it can be copied straight in. */
export function settingText(setting: number): string {
  return new Intl.NumberFormat("en", { useGrouping: false, maximumFractionDigits: 3 }).format(setting).replace("\u2212", "-");
}

/** A figure in prose, with a real minus sign. */
export function figureText(n: number, digits = 3): string {
  return n < 0 ? `\u2212${formatFigure(-n, digits)}` : formatFigure(n, digits);
}

/**
 * One or two short lines saying what `setting` means: for the voltage scale the divider ratio,
 * for the current scale the sensor's mV per amp, for the offset its size in the family's unit.
 * Returns [] when the setting cannot stand for anything physical (e.g. a scale of 0).
 */
export function settingMeaning(quantity: QuantityKey, setting: number, units: FamilyUnits): string[] {
  try {
    if (quantity === "voltageScale") {
      const ratio = ratioFromVoltageScaleSetting(setting, voltageUnits(units));
      const divider = `divider ratio ÷${formatFigure(ratio, 2)}: pack volts per volt at the ADC pin`;
      if (units.voltageScale.unit === "V/V") return [divider];
      return [`${formatFigure(setting * units.voltageScale.step)} mV at the ADC pin per pack volt`, divider];
    }
    if (quantity === "currentScale") {
      const mvPerAmp = sensitivityFromCurrentScaleSetting(setting, currentUnits(units));
      const sensor = `${formatFigure(mvPerAmp, 2)} mV per amp from the current sensor`;
      if (units.currentScale.unit === "mV/A") return [sensor];
      return [`${formatFigure(setting * units.currentScale.step)} A per volt of sensor output`, sensor];
    }
    const value = setting * units.currentOffset.step;
    return units.currentOffset.unit === "mV"
      ? [`${figureText(value)} mV correction to the sensor output at zero current`]
      : [`${figureText(value)} mA correction to the current reading`];
  } catch {
    return [];
  }
}

/** The setting the revision's parts list implies in this family, or null when a part is unknown. */
export function settingFromParts(quantity: QuantityKey, parts: PartsFigures, units: FamilyUnits): number | null {
  try {
    if (quantity === "voltageScale" && parts.dividerRatio !== null) {
      return roundSetting(voltageScaleSettingFromRatio(parts.dividerRatio, voltageUnits(units)));
    }
    if (quantity === "currentScale" && parts.sensitivityMvPerAmp !== null) {
      return roundSetting(currentScaleSettingFromSensitivity(parts.sensitivityMvPerAmp, currentUnits(units)));
    }
  } catch {
    // an impossible part value on record: say nothing rather than something wrong
  }
  return null;
}

/** The sensor parts behind PartsFigures, for spelling out the arithmetic. */
export type PartsDetail = PartsFigures & { currentSensor: "shunt" | "hall" | null; shuntMilliohms: number | null; amplifierGain: number | null };

/**
 * How settingFromParts got its number, in one line a builder can check with a calculator
 * (divider formula and Ohm's law as lib/calibration/units.ts applies them); null when it has none.
 */
export function partsArithmetic(quantity: QuantityKey, parts: PartsDetail, units: FamilyUnits): string | null {
  const setting = settingFromParts(quantity, parts, units);
  if (setting === null) return null;
  const f = (n: number) => formatFigure(n, 3);
  if (quantity === "voltageScale") {
    const { unit, step } = units.voltageScale;
    const ratio = parts.dividerRatio!;
    return unit === "V/V"
      ? `divider ratio ÷${f(ratio)} ÷ ${f(step)} V/V a step = ${setting}`
      : `1000 ÷ ${f(ratio)} = ${f(1000 / ratio)} mV/V, ÷ ${f(step)} mV/V a step = ${setting}`;
  }
  const { unit, step } = units.currentScale;
  const mv = parts.sensitivityMvPerAmp!;
  const source =
    parts.currentSensor === "shunt" && parts.shuntMilliohms !== null && parts.amplifierGain !== null
      ? `${f(parts.shuntMilliohms)} mΩ shunt × gain ${f(parts.amplifierGain)} = ${f(mv)} mV/A`
      : `${f(mv)} mV/A from the Hall sensor`;
  return unit === "mV/A"
    ? `${source}, ÷ ${f(step)} mV/A a step = ${setting}`
    : `${source}; 1000 ÷ ${f(mv)} = ${f(1000 / mv)} A/V, ÷ ${f(step)} A/V a step = ${setting}`;
}
