import type { BoardRevision } from "@/models/Board";
import type { CurrentSensorKind } from "@/lib/vocabulary";
import type { HardwareWorksheetInput } from "./hardware";

// The hardware worksheet's figures as a form holds them: one number (or null = unknown) per part,
// prefilled from the board revision record and overridden by what the builder reads off the parts.
// Free of server imports so the browser form and its tests share the mapping to hardwareWorksheet.

export const HARDWARE_FIGURE_KEYS = [
  "dividerTopOhms",
  "dividerBottomOhms",
  "shuntMilliohms",
  "amplifierGain",
  "hallMvPerAmp",
  "adcBits",
  "adcReferenceVolts",
  "maxCells",
] as const;
export type HardwareFigureKey = (typeof HARDWARE_FIGURE_KEYS)[number];

export type HardwareFigures = { currentSensor: CurrentSensorKind | null } & Record<HardwareFigureKey, number | null>;

/** The revision columns the worksheet reads (null = the maker did not say). */
export type RevisionHardware = Pick<
  BoardRevision,
  "dividerTopOhms" | "dividerBottomOhms" | "currentSensor" | "shuntMilliohms" | "amplifierGain" | "hallMvPerAmp" | "adcBits" | "adcReferenceVolts"
>;

/** A board revision row (and its board's largest pack) as the worksheet's starting figures. */
export function hardwareFiguresFromRevision(revision: RevisionHardware | null, maxCells: number | null): HardwareFigures {
  return {
    dividerTopOhms: revision?.dividerTopOhms ?? null,
    dividerBottomOhms: revision?.dividerBottomOhms ?? null,
    currentSensor: revision?.currentSensor ?? null,
    shuntMilliohms: revision?.shuntMilliohms ?? null,
    amplifierGain: revision?.amplifierGain ?? null,
    hallMvPerAmp: revision?.hallMvPerAmp ?? null,
    adcBits: revision?.adcBits ?? null,
    adcReferenceVolts: revision?.adcReferenceVolts ?? null,
    maxCells,
  };
}

/**
 * Where hardwareWorksheet files a problem with each figure, so a form shows it beside that input.
 * A part group (divider, sensor, ADC) is left out only when all its figures are unknown; half of a
 * pair is kept as undefined so the worksheet asks for the other half instead of ignoring the pair.
 */
export const HARDWARE_FIELD_PATHS: Record<HardwareFigureKey, string> = {
  dividerTopOhms: "divider.topOhms",
  dividerBottomOhms: "divider.bottomOhms",
  shuntMilliohms: "currentSensor.shuntMilliohms",
  amplifierGain: "currentSensor.amplifierGain",
  hallMvPerAmp: "currentSensor.mvPerAmp",
  adcBits: "adc.bits",
  adcReferenceVolts: "adc.vrefVolts",
  maxCells: "maxCells",
};

const given = (n: number | null): number => (n == null ? (undefined as unknown as number) : n);
const pairOrNull = <T>(a: number | null, b: number | null, build: (a: number, b: number) => T): T | null =>
  a == null && b == null ? null : build(given(a), given(b));

export function hardwareWorksheetInput(
  figures: HardwareFigures,
  extra: { published?: HardwareWorksheetInput["published"]; atAmps?: number | null } = {},
): HardwareWorksheetInput {
  const f = figures;
  const currentSensor: HardwareWorksheetInput["currentSensor"] =
    f.currentSensor === "shunt"
      ? pairOrNull(f.shuntMilliohms, f.amplifierGain, (shuntMilliohms, amplifierGain) => ({ kind: "shunt" as const, shuntMilliohms, amplifierGain }))
      : f.currentSensor === "hall" && f.hallMvPerAmp != null
        ? { kind: "hall", mvPerAmp: f.hallMvPerAmp }
        : null;
  return {
    divider: pairOrNull(f.dividerTopOhms, f.dividerBottomOhms, (topOhms, bottomOhms) => ({ topOhms, bottomOhms })),
    currentSensor,
    adc: pairOrNull(f.adcReferenceVolts, f.adcBits, (vrefVolts, bits) => ({ vrefVolts, bits })),
    maxCells: f.maxCells,
    published: extra.published ?? null,
    atAmps: extra.atAmps ?? null,
  };
}

export type FigureOrigin = "board" | "typed" | "unknown";

/** Whether a figure in force is the board record's, the builder's own, or not known at all. */
export function figureOrigin(fromBoard: number | null, inForce: number | null): FigureOrigin {
  if (inForce == null) return "unknown";
  return fromBoard != null && fromBoard === inForce ? "board" : "typed";
}

/**
 * How far apart the parts' figure and a published value may be before it means more than parts
 * tolerance: two 1 % divider resistors, or a 1 % shunt through an amplifier whose gain is good to
 * a per cent or two, stay within about 3 %; past 10 % it is a different part, not a spread
 * (both thresholds common practice, no source).
 */
const PARTS_TOLERANCE_PERCENT = 3;
const DIFFERENT_PART_PERCENT = 10;

export type ComparisonVerdict = "same-setting" | "within-tolerance" | "beyond-tolerance" | "different-part";

/** What a difference between the parts' setting and the published one means, in plain words. */
export function comparisonVerdict(
  setting: "voltage" | "current",
  nearestSetting: number,
  comparison: { published: number; differencePercent: number },
): { verdict: ComparisonVerdict; message: string } {
  const d = Math.abs(comparison.differencePercent);
  const parts = setting === "voltage" ? "the divider resistors" : "the shunt and amplifier (or the Hall sensor)";
  if (Math.round(comparison.published) === nearestSetting) {
    return { verdict: "same-setting", message: `The parts and the published value give the same setting: ${parts} are what the record says.` };
  }
  if (d <= PARTS_TOLERANCE_PERCENT) {
    return {
      verdict: "within-tolerance",
      message: `Within the usual spread of parts tolerance (±${PARTS_TOLERANCE_PERCENT} %): boards built from the same ${parts} differ this much, and builders' calibrations absorb it.`,
    };
  }
  if (d <= DIFFERENT_PART_PERCENT) {
    return {
      verdict: "beyond-tolerance",
      message: `More than parts tolerance explains. Check the markings on ${parts}, that the quad's board revision is right, and that builders calibrated the same way (with the same stacked ESC, for current).`,
    };
  }
  return {
    verdict: "different-part",
    message: `Far apart: most likely a different board revision, a different part fitted than the record says, or a wrong figure (in the record or typed here).${setting === "current" ? " A flight controller whose current comes from a stacked ESC takes the ESC's sensor." : ""}`,
  };
}
