import { z } from "zod";
import { currentScaleSettingFromSensitivity, dividerRatio, roundSetting, shuntSensitivityMvPerAmp, voltageScaleSettingFromRatio } from "./units";
import { formatFigure } from "@/lib/catalogue/format";
import { CELL_VOLTS_CEILING } from "@/lib/submissions/limits";
import { adcLsbVolts, adcSpecSchema } from "./adc";
import { cellsField, numberField, positiveNumber, type WorksheetFamily } from "./fields";
import { failed, ok, parseInput, type FieldIssue, type WorksheetResult } from "./result";
import { SOURCES } from "./sources";

// From the hardware (issue "Calibration worksheets"): what the board's parts imply the settings
// should be, before any flight, in the family's units, beside a published value. The conversions
// are units.ts (one implementation): the divider ratio (R1 + R2) ÷ R2 from Vout = Vin·R2/(R1+R2)
// (Horowitz & Hill, from memory), and a shunt's sensitivity R × gain by Ohm's law (a Hall sensor's
// datasheet figure is already mV/A). The ADC figures use 1 LSB = Vref / 2^N (adc.ts).

type CurrentSensorInput = { kind: "shunt"; shuntMilliohms: number; amplifierGain: number } | { kind: "hall"; mvPerAmp: number };

export type HardwareWorksheetInput = {
  divider?: { topOhms: number; bottomOhms: number } | null;
  currentSensor?: CurrentSensorInput | null;
  /** Values to compare with, in steps (a board maker's figure, or the community median). */
  published?: { voltageScale?: number | null; currentScale?: number | null } | null;
  /** For the divider's headroom and resolution. */
  adc?: { vrefVolts: number; bits: number } | null;
  /** Largest pack the board takes, for the headroom at 4.35 V a cell. */
  maxCells?: number | null;
  /** A current to show the sensor's output (and the shunt's heat) at. */
  atAmps?: number | null;
};

type Comparison = { published: number; differencePercent: number } | null;

export type HardwareWorksheet = {
  voltage: {
    dividerRatio: number;
    exactSetting: number;
    nearestSetting: number;
    comparison: Comparison;
    /** With an ADC and a cell count: whether a full HV pack still fits under the reference. */
    headroom: {
      /** Vref × ratio: the pack voltage at which the pin reaches the reference. */
      fullScalePackVolts: number;
      /** One ADC count at the pack: Vref / 2^N × ratio. */
      packVoltsPerCount: number;
      /** With maxCells: a full HV pack (4.35 V a cell), the ratio it needs (pack ÷ Vref) and whether this one saturates. */
      neededPackVolts: number | null;
      minimumRatio: number | null;
      saturates: boolean | null;
    } | null;
    /** The arithmetic in words, for the page; `source` names where it comes from, for code and docs. */
    formula: string;
    source: string;
  } | null;
  current: {
    sensitivityMvPerAmp: number;
    exactSetting: number;
    nearestSetting: number;
    comparison: Comparison;
    /** Sensor output at atAmps, and for a shunt the heat in it (I²R). */
    atAmps: { amps: number; outputVolts: number; shuntWatts: number | null } | null;
    formula: string;
    source: string;
  } | null;
};

const sensorSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({
      kind: z.literal("shunt"),
      shuntMilliohms: positiveNumber("The shunt resistance", "mΩ", 1000),
      amplifierGain: positiveNumber("The amplifier gain", "V/V", 10_000),
    }),
    z.object({ kind: z.literal("hall"), mvPerAmp: positiveNumber("The Hall sensor's sensitivity", "mV/A", 10_000) }),
  ],
  { error: 'Say which current sensor: "shunt" or "hall"' },
);

const schema = z.object({
  divider: z.object({ topOhms: positiveNumber("The top resistor", "Ω", 1e8), bottomOhms: positiveNumber("The bottom resistor", "Ω", 1e8) }).nullish(),
  currentSensor: sensorSchema.nullish(),
  published: z
    .object({
      voltageScale: positiveNumber("The published voltage scale", "").nullish(),
      currentScale: positiveNumber("The published current scale", "").nullish(),
    })
    .nullish(),
  adc: adcSpecSchema.nullish(),
  maxCells: cellsField().nullish(),
  atAmps: numberField("The current to check at")
    .min(0, "The current to check at cannot be negative")
    .max(1000, "The current to check at must be at most 1000 A")
    .nullish(),
});

const compare = (published: number | null | undefined, exact: number): Comparison =>
  published == null ? null : { published, differencePercent: ((published - exact) / exact) * 100 };

export function hardwareWorksheet(input: HardwareWorksheetInput, family: WorksheetFamily): WorksheetResult<HardwareWorksheet> {
  const parsed = parseInput(schema, input);
  if ("errors" in parsed) return failed(parsed.errors);
  const { divider, currentSensor, published, adc, maxCells, atAmps } = parsed.data;
  if (!divider && !currentSensor) return failed([{ field: "input", message: "Give the divider resistors, the current sensor, or both" }]);
  const warnings: FieldIssue[] = [];

  let voltage: HardwareWorksheet["voltage"] = null;
  if (divider) {
    const ratio = dividerRatio(divider.topOhms, divider.bottomOhms);
    const exact = voltageScaleSettingFromRatio(ratio, family);
    let headroom: NonNullable<HardwareWorksheet["voltage"]>["headroom"] = null;
    if (adc) {
      const needed = maxCells == null ? null : maxCells * CELL_VOLTS_CEILING;
      const fullScale = adc.vrefVolts * ratio;
      headroom = {
        fullScalePackVolts: fullScale,
        packVoltsPerCount: adcLsbVolts(adc) * ratio,
        neededPackVolts: needed,
        minimumRatio: needed == null ? null : needed / adc.vrefVolts,
        saturates: needed == null ? null : needed > fullScale,
      };
      if (needed != null && needed > fullScale) {
        warnings.push({
          field: "divider",
          message: `A ÷${formatFigure(ratio, 2)} divider reads at most ${formatFigure(fullScale, 2)} V on a ${adc.vrefVolts} V ADC, below a full ${maxCells}S HV pack (${formatFigure(needed, 2)} V at 4.35 V a cell): the display would stick at the top`,
        });
      }
    }
    voltage = {
      dividerRatio: ratio,
      exactSetting: exact,
      nearestSetting: roundSetting(exact),
      comparison: compare(published?.voltageScale, exact),
      headroom,
      formula: "divider ratio = (top resistor + bottom resistor) ÷ bottom resistor",
      source: SOURCES.divider,
    };
  }

  let current: HardwareWorksheet["current"] = null;
  if (currentSensor) {
    const sensitivity =
      currentSensor.kind === "shunt" ? shuntSensitivityMvPerAmp(currentSensor.shuntMilliohms, currentSensor.amplifierGain) : currentSensor.mvPerAmp;
    const exact = currentScaleSettingFromSensitivity(sensitivity, family);
    const at =
      atAmps == null
        ? null
        : {
            amps: atAmps,
            outputVolts: (sensitivity * atAmps) / 1000,
            shuntWatts: currentSensor.kind === "shunt" ? atAmps ** 2 * (currentSensor.shuntMilliohms / 1000) : null,
          };
    // A shunt amplifier starts at 0 V; a bidirectional Hall sensor rests at Vcc/2, so its swing is judged elsewhere.
    if (at && adc && currentSensor.kind === "shunt" && at.outputVolts > adc.vrefVolts) {
      warnings.push({
        field: "atAmps",
        message: `At ${atAmps} A the amplifier would put out ${formatFigure(at.outputVolts, 3)} V, above the ${adc.vrefVolts} V ADC reference: readings above ${formatFigure((adc.vrefVolts * 1000) / sensitivity, 1)} A stick at the top`,
      });
    }
    current = {
      sensitivityMvPerAmp: sensitivity,
      exactSetting: exact,
      nearestSetting: roundSetting(exact),
      comparison: compare(published?.currentScale, exact),
      atAmps: at,
      formula: currentSensor.kind === "shunt" ? "mV/A = shunt mΩ × amplifier gain" : "mV/A as the Hall sensor's datasheet gives it",
      source: currentSensor.kind === "shunt" ? SOURCES.ohm : "Hall sensor datasheet sensitivity (mV/A)",
    };
    if (sensitivity < 2 || sensitivity > 200) {
      warnings.push({
        field: "currentSensor",
        message: `${formatFigure(sensitivity, 3)} mV/A is outside the 2–200 mV/A usual for hobby boards: check the figures`,
      });
    }
  }
  return ok({ voltage, current }, warnings);
}
