import { z } from "zod";
import { impliedVoltageScale } from "./evidence";
import { formatFigure } from "@/lib/catalogue/format";
import { medianOfSorted, sortedCopy } from "@/lib/stats";
import { CELL_VOLTS_CEILING, CELL_VOLTS_FLOOR, MAX_CELLS, MAX_READINGS, MIN_CELLS, REPORTED_VOLTS_SLACK, packVoltsRange } from "@/lib/submissions/limits";
import { cellsField, positiveNumber, settingField, settingRange, type WorksheetFamily } from "./fields";
import { failed, ok, parseInput, type FieldIssue, type WorksheetResult } from "./result";
import { VOLTAGE_HIGH_ALLOWANCE, VOLTAGE_ROUNDING_WHY, predictedReadingError, roundBothWays, type SettingRoundings } from "./rounding";
import { SOURCES } from "./sources";

// Voltage worksheet (issue "Calibration worksheets", section 2): the OSD's pack voltage beside a
// multimeter's, one or several pairs, and the voltage scale that makes the display read true.
//
// The rule is evidence.ts impliedVoltageScale (one implementation): the display shows
// V_d = V_true × (ratio the setting stands for ÷ true ratio), so
//   'proportional' unit (V/V):  next = current × measured ÷ reported;
//   'inverse' unit (mV/V):      the setting is 1000 ÷ ratio, so next = current × reported ÷ measured.
// (Common practice, no source.)
//
// Several pairs combine by the MEDIAN of the per-pair implied settings, not a least-squares ratio
// through the origin: every pair measures the same ratio, and least squares (Σxy ÷ Σx²) weighs the
// highest voltages most and follows a single misread digit, where the median of three ignores it.

/**
 * A display within 1 % of the multimeter needs no change (common practice, no source). 1 % is the
 * stricter of the two usual rules everywhere in a cell's 2.5–4.35 V range (0.05 V a cell is
 * 1.15–2 % of it), so the per-cell error is shown beside it but does not decide.
 */
export const VOLTAGE_TOLERANCE = 0.01;
const VOLTAGE_TOLERANCE_SOURCE = SOURCES.commonPractice;

export type VoltageWorksheetInput = {
  /** The voltage scale in force when the readings were taken, in steps. */
  scaleUsed: number;
  readings: ReadonlyArray<{ cells: number; reportedVolts: number; measuredVolts: number }>;
};

type VoltagePair = {
  index: number;
  cells: number;
  reportedVolts: number;
  measuredVolts: number;
  /** reported ÷ measured − 1: +0.02 reads 2 % high. */
  readingError: number;
  /** (reported − measured) ÷ cells, in volts. */
  errorVoltsPerCell: number;
  /** The exact setting this pair alone implies, in steps. */
  impliedScale: number;
};

export type VoltageWorksheet = {
  scaleUsed: number;
  pairs: VoltagePair[];
  combination: "median of per-pair implied settings";
  /** The exact setting that makes the display read true, in steps. */
  impliedScale: number;
  tolerance: { relative: number; source: string };
  /** How the display reads with the scale in force. */
  now: { readingError: number; errorVoltsPerCell: number; withinTolerance: boolean };
  /** Floor and ceil of the exact setting, and the recommended one (VOLTAGE_ROUNDING_WHY). */
  rounding: SettingRoundings & { why: string };
  /** "keep": the scale in force is already within tolerance (or is the recommended step); "change": enter rounding.recommended. */
  verdict: "keep" | "change";
  /** The one setting this worksheet answers with: the headline's, and what Publish sends. */
  answer: number;
  message: string;
};

function readingSchema() {
  return z
    .object({
      cells: cellsField(),
      reportedVolts: positiveNumber("The reported voltage", "V"),
      measuredVolts: positiveNumber("The multimeter voltage", "V"),
    })
    .superRefine((v, ctx) => {
      // zod still runs this after a field failed its own check; judge only what passed it
      if (!(Number.isInteger(v.cells) && v.cells >= MIN_CELLS && v.cells <= MAX_CELLS)) return;
      const [lo, hi] = packVoltsRange(v.cells);
      const span = `${formatFigure(lo, 2)}–${formatFigure(hi, 2)} V`;
      // the floor under load is BMFA safety guidance; 4.35 V full HV cells is the vendors' figure (common practice)
      const limits = `${CELL_VOLTS_FLOOR}–${CELL_VOLTS_CEILING} V a cell`;
      if (v.measuredVolts > 0 && (v.measuredVolts < lo || v.measuredVolts > hi)) {
        ctx.addIssue({
          code: "custom",
          path: ["measuredVolts"],
          message: `A ${v.cells}S pack measures ${span} (${limits}); ${v.measuredVolts} V cannot be right — check the cell count and the multimeter's range`,
        });
      }
      // A display may be badly off before calibration, so it gets the submissions' slack (limits.ts).
      if (v.reportedVolts > 0 && (v.reportedVolts < lo / REPORTED_VOLTS_SLACK || v.reportedVolts > hi * REPORTED_VOLTS_SLACK)) {
        ctx.addIssue({
          code: "custom",
          path: ["reportedVolts"],
          message: `${v.reportedVolts} V is impossible for a ${v.cells}S pack (${span}), even on a badly set display — check the cell count, or start from the scale the hardware implies`,
        });
      }
    });
}

const median = (values: number[]) => medianOfSorted(sortedCopy(values))!;

export function voltageWorksheet(input: VoltageWorksheetInput, family: WorksheetFamily, tolerance = VOLTAGE_TOLERANCE): WorksheetResult<VoltageWorksheet> {
  const schema = z.object({
    scaleUsed: settingField("The voltage scale in force", family, "voltageScale"),
    readings: z.array(readingSchema()).min(1, "Add at least one pair of readings").max(MAX_READINGS, `At most ${MAX_READINGS} pairs`),
  });
  if (!(tolerance > 0 && tolerance < 0.5)) return failed([{ field: "tolerance", message: "The tolerance is a fraction above 0 and below 0.5 (0.01 for 1 %)" }]);
  const parsed = parseInput(schema, input);
  if ("errors" in parsed) return failed(parsed.errors);
  const { scaleUsed, readings } = parsed.data;
  const response = family.voltageScaleResponse;

  const pairs: VoltagePair[] = readings.map((r, index) => ({
    index,
    cells: r.cells,
    reportedVolts: r.reportedVolts,
    measuredVolts: r.measuredVolts,
    readingError: r.reportedVolts / r.measuredVolts - 1,
    errorVoltsPerCell: (r.reportedVolts - r.measuredVolts) / r.cells,
    impliedScale: impliedVoltageScale(scaleUsed, r.reportedVolts, r.measuredVolts, response),
  }));
  const implied = median(pairs.map((p) => p.impliedScale));
  const readingError = predictedReadingError(scaleUsed, implied, response);
  const withinTolerance = Math.abs(readingError) <= tolerance;

  const warnings: FieldIssue[] = [];
  const spread = Math.max(...pairs.map((p) => p.impliedScale)) - Math.min(...pairs.map((p) => p.impliedScale));
  if (pairs.length > 1 && spread > 2 * tolerance * implied) {
    warnings.push({
      field: "readings",
      message: `The pairs disagree by ${formatFigure((100 * spread) / implied, 1)} % among themselves: read the display and the multimeter at the same moment, with the pack at rest and the meter on the main lead`,
    });
  }
  const rounding = { ...roundBothWays(implied, response, "low", settingRange(family, "voltageScale"), VOLTAGE_HIGH_ALLOWANCE), why: VOLTAGE_ROUNDING_WHY };
  if (!rounding.recommended.withinRange) {
    warnings.push({
      field: "scaleUsed",
      message: `The implied setting ${rounding.recommended.setting} is outside ${family.name}'s range ${family.voltageScaleMin}–${family.voltageScaleMax}: check the readings and that the board's divider suits this family`,
    });
  }
  const left = rounding.recommended.readingError;
  if (left != null && Math.abs(left) > tolerance) {
    warnings.push({
      field: "scaleUsed",
      message: `One step of ${family.name}'s voltage scale is ${formatFigure(100 / implied, 2)} % of the setting, so even ${rounding.recommended.setting} leaves the display ${formatFigure(100 * Math.abs(left), 2)} % off, beyond the ${formatFigure(100 * tolerance, 2)} % tolerance: no whole step does better on the safe side`,
    });
  }

  const errorVoltsPerCell = median(pairs.map((p) => p.errorVoltsPerCell));
  const pct = formatFigure(100 * Math.abs(readingError), 2);
  const dir = readingError >= 0 ? "high" : "low";
  const keep = withinTolerance || rounding.recommended.setting === scaleUsed;
  const message = keep
    ? `The display reads ${pct} % ${dir}, within ${formatFigure(100 * tolerance, 2)} %: keep ${scaleUsed}.`
    : `The display reads ${pct} % ${dir} (${formatFigure(Math.abs(errorVoltsPerCell), 3)} V a cell): enter ${rounding.recommended.setting}.`;
  return ok(
    {
      scaleUsed,
      pairs,
      combination: "median of per-pair implied settings",
      impliedScale: implied,
      tolerance: { relative: tolerance, source: VOLTAGE_TOLERANCE_SOURCE },
      now: { readingError, errorVoltsPerCell, withinTolerance },
      rounding,
      verdict: keep ? "keep" : "change",
      answer: keep ? scaleUsed : rounding.recommended.setting,
      message,
    },
    warnings,
  );
}
