import { z } from "zod";
import { formatFigure } from "@/lib/catalogue/format";
import { MAX_CELLS, MAX_MAH, MIN_CELLS } from "@/lib/submissions/limits";
import type { FamilyUnitFields, FirmwareFamily } from "@/models/FirmwareFamily";

// The zod field builders the worksheets share, with the limits of lib/submissions/limits.ts so a
// worksheet refuses what the contribution form refuses, in words of the same kind.

/** The family columns the worksheets read (plain objects in tests and on the client). */
export type WorksheetFamily = Pick<FirmwareFamily, "name"> & FamilyUnitFields;

/** "The reported mAh" → "the reported mAh": only the first letter, so units keep their case. */
const lowerFirst = (label: string) => label.charAt(0).toLowerCase() + label.slice(1);

/** A number: "Enter …" when missing, "… must be a number" otherwise (zod refuses NaN and ±Infinity). */
export const numberField = (label: string) =>
  z.number({ error: (issue) => (issue.input == null || issue.input === "" ? `Enter ${lowerFirst(label)}` : `${label} must be a number`) });

export const positiveNumber = (label: string, unit: string, max?: number) => {
  const field = numberField(label).positive(`${label} must be more than 0 ${unit}`.trim());
  return max == null ? field : field.max(max, `${label} must be at most ${max.toLocaleString("en")} ${unit}`.trim());
};

export const mahField = (label: string) => positiveNumber(label, "mAh", MAX_MAH);

export const cellsField = () =>
  numberField("The pack's cell count")
    .int("A cell count is a whole number, like 4 for a 4S pack")
    .min(MIN_CELLS, `A pack has ${MIN_CELLS} to ${MAX_CELLS} cells`)
    .max(MAX_CELLS, `A pack has ${MIN_CELLS} to ${MAX_CELLS} cells`);

export type SettingKind = "voltageScale" | "currentScale" | "currentOffset";

function rangeOf(family: WorksheetFamily, kind: SettingKind) {
  if (kind === "voltageScale")
    return { min: family.voltageScaleMin, max: family.voltageScaleMax, step: family.voltageScaleStep, unit: family.voltageScaleUnit };
  if (kind === "currentScale")
    return { min: family.currentScaleMin, max: family.currentScaleMax, step: family.currentScaleStep, unit: family.currentScaleUnit };
  return { min: family.currentOffsetMin, max: family.currentOffsetMax, step: family.currentOffsetStep, unit: family.currentOffsetUnit };
}

/** The family's setting range for a kind, as a rounding check wants it. */
export const settingRange = (family: WorksheetFamily, kind: SettingKind) => {
  const { min, max } = rangeOf(family, kind);
  return { min, max };
};

/** "1 step = 0.02 mV/A" */
const stepText = (family: WorksheetFamily, kind: SettingKind) => {
  const r = rangeOf(family, kind);
  return `1 step = ${formatFigure(r.step, 6)} ${r.unit}`;
};

/** A firmware setting: a whole number of steps inside the family's range (scales also above 0). */
export function settingField(label: string, family: WorksheetFamily, kind: SettingKind) {
  const r = rangeOf(family, kind);
  return numberField(label).superRefine((value, ctx) => {
    const fail = (message: string) => ctx.addIssue({ code: "custom", message });
    if (!Number.isInteger(value)) fail(`${label} is a whole number of setting steps (${stepText(family, kind)}): the firmware stores integers`);
    else if (kind !== "currentOffset" && value <= 0) fail(`${label} must be more than 0: a scale of ${value} cannot turn a sensor reading into volts or amps`);
    else if (value < r.min || value > r.max) fail(`${label} must be between ${r.min} and ${r.max} in ${family.name} (${stepText(family, kind)})`);
  });
}
