import type { BoardRevision, CurrentSensorKind } from "@/models/BoardRevision";
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
