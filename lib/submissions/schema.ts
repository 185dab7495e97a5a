import { z } from "zod";
import { multiLine } from "@/lib/input/text";
import { LineFitError, fitLine } from "@/lib/calibration/least-squares";
import { formatCells, formatFigure } from "@/lib/catalogue/format";
import { MAX_PHOTOS_PER_SUBMISSION } from "@/lib/storage/limits";
import type { FamilyUnitFields, FirmwareFamily } from "@/models/FirmwareFamily";
import { MEASURED_AT, type Method, METHODS, SENSING_SOURCES } from "@/lib/vocabulary";
import {
  FIRMWARE_VERSION_RE,
  MAX_BENCH_AMPS,
  MAX_BENCH_POINTS,
  MAX_CELLS,
  MAX_CHARGED_OVER_RATED,
  MAX_CYCLES,
  MAX_MAH,
  MAX_READINGS,
  MAX_READING_RATIO,
  MIN_BENCH_POINTS,
  MIN_CELLS,
  MIN_READING_RATIO,
  MIN_REPORTED_AMPS,
  NOTES_MAX_LENGTH,
  REPORTED_VOLTS_SLACK,
  packVoltsRange,
} from "./limits";

// THE schema of a contribution: the form validates with it (react-hook-form + zodResolver) and
// POST/PATCH /api/v1/submissions parse with it, so both sides refuse the same input with the same
// words, keyed by the same field paths ("cycles.2.chargedMah").
//
// Some limits depend on what was chosen — the firmware family's setting range, the board's cell
// range — so the schema is made for a context. Without one it checks everything that does not
// depend on it; the server always passes the family and board it loaded.

/** The family columns the schema reads (plain objects on the client). */
export type FamilyRules = Pick<FirmwareFamily, "name"> & Omit<FamilyUnitFields, "voltageScaleResponse" | "currentScaleResponse">;
export type BoardRules = { minCells: number; maxCells: number };
export type SchemaContext = { family?: FamilyRules | null; board?: BoardRules | null };

/** A number field: "Enter …" when empty, "… must be a number" for anything else that is not one. */
const numberField = (label: string) =>
  z.number({ error: (issue) => (issue.input == null || issue.input === "" ? `Enter ${label}` : `${label} must be a number`) });

type Range = { min: number; max: number; unit: string; step: number; familyName: string };

/** A firmware setting: a whole number of the family's steps, within the family's range. */
function setting(label: string, opts: { positive: boolean; range?: Range }) {
  return numberField(label.toLowerCase()).superRefine((value, ctx) => {
    const fail = (message: string) => ctx.addIssue({ code: "custom", message });
    if (!Number.isInteger(value)) {
      fail(
        `${label} is a whole number of setting steps${opts.range ? ` (1 step = ${formatFigure(opts.range.step, 6)} ${opts.range.unit})` : ""}: the firmware stores integers`,
      );
    } else if (opts.positive && value <= 0) {
      fail(`${label} must be more than 0: a scale of ${value} cannot turn a sensor reading into volts or amps`);
    } else if (opts.range && (value < opts.range.min || value > opts.range.max)) {
      fail(
        `${label} must be between ${opts.range.min} and ${opts.range.max} in ${opts.range.familyName} (1 step = ${formatFigure(opts.range.step, 6)} ${opts.range.unit})`,
      );
    }
  });
}

function ranges(family: FamilyRules | null | undefined) {
  if (!family) return {};
  return {
    voltage: {
      min: family.voltageScaleMin,
      max: family.voltageScaleMax,
      unit: family.voltageScaleUnit,
      step: family.voltageScaleStep,
      familyName: family.name,
    },
    current: {
      min: family.currentScaleMin,
      max: family.currentScaleMax,
      unit: family.currentScaleUnit,
      step: family.currentScaleStep,
      familyName: family.name,
    },
    offset: {
      min: family.currentOffsetMin,
      max: family.currentOffsetMax,
      unit: family.currentOffsetUnit,
      step: family.currentOffsetStep,
      familyName: family.name,
    },
  } satisfies Record<string, Range>;
}

function cells(board: BoardRules | null | undefined) {
  const [min, max] = board ? [board.minCells, board.maxCells] : [MIN_CELLS, MAX_CELLS];
  return numberField("the pack's cell count").superRefine((value, ctx) => {
    if (!Number.isInteger(value)) ctx.addIssue({ code: "custom", message: "A cell count is a whole number, like 4 for a 4S pack" });
    else if (value < MIN_CELLS || value > MAX_CELLS)
      ctx.addIssue({ code: "custom", message: `A pack has ${MIN_CELLS} to ${MAX_CELLS} cells; ${value} is not possible` });
    else if (value < min || value > max)
      ctx.addIssue({ code: "custom", message: `This board takes ${formatCells(min, max)} packs; ${value}S is outside that` });
  });
}

/** mAh: refused below 0 with its own message, and 0 because no ratio can be formed with it. */
function mah(label: string) {
  return numberField(label.toLowerCase()).superRefine((value, ctx) => {
    if (value < 0) ctx.addIssue({ code: "custom", message: `${label} cannot be negative` });
    else if (value === 0) ctx.addIssue({ code: "custom", message: `${label} must be more than 0` });
    else if (value > MAX_MAH) ctx.addIssue({ code: "custom", message: `${label} must be at most ${MAX_MAH.toLocaleString("en")} mAh` });
  });
}

function volts(label: string) {
  return numberField(label.toLowerCase()).superRefine((value, ctx) => {
    if (value <= 0) ctx.addIssue({ code: "custom", message: `${label} must be more than 0 V` });
  });
}

function amps(label: string, min: number) {
  return numberField(label.toLowerCase()).min(min, `${label} must be at least ${min} A`).max(MAX_BENCH_AMPS, `${label} must be at most ${MAX_BENCH_AMPS} A`);
}

const ratioText = (r: number) => formatFigure(r, 2);

export function submissionSchema(context: SchemaContext = {}) {
  const r = ranges(context.family);

  const reading = z
    .object({
      cells: cells(context.board),
      reportedVolts: volts("The reported voltage"),
      measuredVolts: volts("The multimeter voltage"),
      measuredAt: z.enum(MEASURED_AT, { error: "Say where the multimeter touched: the main lead or the balance plug's outer pins" }),
    })
    .superRefine((v, ctx) => {
      const [lo, hi] = packVoltsRange(v.cells);
      const span = `${formatFigure(lo, 2)}–${formatFigure(hi, 2)} V`;
      if (v.measuredVolts < lo || v.measuredVolts > hi) {
        ctx.addIssue({
          code: "custom",
          path: ["measuredVolts"],
          message: `A ${v.cells}S pack measures ${span} (2.5–4.35 V a cell); ${v.measuredVolts} V is not possible — check the cell count and the reading`,
        });
      }
      if (v.reportedVolts < lo / REPORTED_VOLTS_SLACK || v.reportedVolts > hi * REPORTED_VOLTS_SLACK) {
        ctx.addIssue({
          code: "custom",
          path: ["reportedVolts"],
          message: `${v.reportedVolts} V is impossible for a ${v.cells}S pack (${span}), even on a badly set display — check the cell count and the reading`,
        });
      }
    });

  const voltageCheck = z.object({
    scaleUsed: setting("The voltage scale used", { positive: true, range: r.voltage }),
    readings: z.array(reading).min(1, "Add at least one reading").max(MAX_READINGS, `At most ${MAX_READINGS} readings`),
  });

  const cycle = z
    .object({
      scaleUsed: setting("The current scale used", { positive: true, range: r.current }),
      reportedMah: mah("The reported mAh"),
      chargedMah: mah("The charged mAh"),
      ratedMah: mah("The pack's rated mAh"),
      cells: cells(context.board),
    })
    .superRefine((v, ctx) => {
      const ratio = v.reportedMah / v.chargedMah;
      if (ratio < MIN_READING_RATIO || ratio > MAX_READING_RATIO) {
        ctx.addIssue({
          code: "custom",
          path: ["reportedMah"],
          message: `The display reported ${ratioText(ratio)} × what the charger put back; outside ${MIN_READING_RATIO}–${MAX_READING_RATIO} × the two cannot be the same flight`,
        });
      }
      if (v.chargedMah > MAX_CHARGED_OVER_RATED * v.ratedMah) {
        ctx.addIssue({
          code: "custom",
          path: ["chargedMah"],
          message: `The charger cannot have put ${v.chargedMah} mAh into a ${v.ratedMah} mAh pack (more than ${MAX_CHARGED_OVER_RATED} × its rating) — check both figures`,
        });
      }
    });

  const benchPoint = z.object({
    reportedAmps: amps("The reported current", MIN_REPORTED_AMPS),
    measuredAmps: amps("The clamp-meter current", 0),
  });

  const bench = z
    .object({
      scaleUsed: setting("The current scale used", { positive: true, range: r.current }),
      offsetUsed: setting("The current offset used", { positive: false, range: r.offset }),
      points: z
        .array(benchPoint)
        .min(MIN_BENCH_POINTS, `Add at least ${MIN_BENCH_POINTS} points: a line needs two`)
        .max(MAX_BENCH_POINTS, `At most ${MAX_BENCH_POINTS} points`),
    })
    .superRefine((v, ctx) => {
      try {
        const { slope } = fitLine(v.points.map((p) => [p.measuredAmps, p.reportedAmps] as const));
        if (!(slope >= MIN_READING_RATIO && slope <= MAX_READING_RATIO)) {
          ctx.addIssue({
            code: "custom",
            path: ["points"],
            message: `The display reads ${ratioText(slope)} A per clamp-meter amp; outside ${MIN_READING_RATIO}–${MAX_READING_RATIO} the points cannot be the same current — check each pair`,
          });
        }
      } catch (error) {
        if (!(error instanceof LineFitError)) throw error;
        ctx.addIssue({ code: "custom", path: ["points"], message: "Take the points at two or more different currents: a line cannot be fitted through one" });
      }
    });

  return (
    z
      .object(
        {
          boardRevisionId: z.number({ error: "Choose the board and its revision" }).int().positive("Choose the board and its revision"),
          firmwareFamilyId: z.number({ error: "Choose the firmware family" }).int().positive("Choose the firmware family"),
          firmwareVersion: z
            .string({ error: "Enter the firmware version" })
            .trim()
            .min(1, "Enter the firmware version, like dunlin")
            .regex(
              FIRMWARE_VERSION_RE,
              "A firmware version is up to 32 letters, digits, dots, plus or minus signs, starting with a letter or digit, like dunlin",
            ),
          sensingSource: z.enum(SENSING_SOURCES, { error: "Choose where the readings come from" }),
          method: z.enum(METHODS, { error: "Choose how you checked the values" }),
          voltageScale: setting("Voltage scale", { positive: true, range: r.voltage }).nullable(),
          currentScale: setting("Current scale", { positive: true, range: r.current }).nullable(),
          currentOffset: setting("Current offset", { positive: false, range: r.offset }).nullable(),
          notes: multiLine(z.string().max(NOTES_MAX_LENGTH, `Notes are limited to ${NOTES_MAX_LENGTH.toLocaleString("en")} characters`), "Notes")
            .nullish()
            .transform((v) => (v && v.trim() !== "" ? v : null)),
          voltageCheck: voltageCheck.nullish().transform((v) => v ?? null),
          cycles: z
            .array(cycle)
            .max(MAX_CYCLES, `At most ${MAX_CYCLES} cycles`)
            .nullish()
            .transform((v) => v ?? []),
          bench: bench.nullish().transform((v) => v ?? null),
          // evidence photos uploaded beforehand (POST /api/v1/photos); lib/storage checks whose they are
          photoIds: z
            .array(z.string({ error: "A photo id is text" }), { error: "photoIds is a list of photo ids" })
            .max(MAX_PHOTOS_PER_SUBMISSION, `A submission can have at most ${MAX_PHOTOS_PER_SUBMISSION} photos`)
            .nullish()
            .transform((v) => v ?? []),
        },
        { error: "Send the submission as one JSON object of its fields" },
      )
      // `when` makes these run even after a field failed, so every message shows on the first submit;
      // but only on an object: a body of null, a number or a list has nothing to cross-check
      .superRefine((value, ctx) => crossFieldChecks(value as unknown as Loose, (path, message) => ctx.addIssue({ code: "custom", path, message })), {
        when: ({ value }) => value !== null && typeof value === "object" && !Array.isArray(value),
      })
  );
}

type SubmissionSchema = ReturnType<typeof submissionSchema>;
/** What the form holds and the API accepts. */
export type SubmissionInput = z.input<SubmissionSchema>;
/** What lib/submissions stores: notes trimmed to null, absent evidence as null / []. */
export type SubmissionPayload = z.output<SubmissionSchema>;

/** Which evidence each method needs; the voltage check may come with any measured method. */
export const METHOD_EVIDENCE: Record<Method, { voltageCheck: "required" | "optional" | "none"; cycles: boolean; bench: boolean }> = {
  multimeter: { voltageCheck: "required", cycles: false, bench: false },
  fly_recharge: { voltageCheck: "optional", cycles: true, bench: false },
  bench_clamp: { voltageCheck: "optional", cycles: false, bench: true },
  unverified: { voltageCheck: "none", cycles: false, bench: false },
};

// The object-level checks run even when a field inside failed (`when` above), so they read the
// value defensively: a field may still be a string or missing here.
type Loose = { [k: string]: unknown };
const present = (v: unknown) => v !== null && v !== undefined;
const listed = (v: unknown) => Array.isArray(v) && v.length > 0;

function crossFieldChecks(v: Loose, add: (path: (string | number)[], message: string) => void): void {
  if (!present(v.voltageScale) && !present(v.currentScale) && !present(v.currentOffset)) {
    add(["voltageScale"], "Enter at least one value: a voltage scale, a current scale or a current offset");
  }
  const method = v.method as Method;
  const needs = METHOD_EVIDENCE[method];
  if (!needs) return; // the method's own error says it
  const hasVoltage = present(v.voltageCheck);
  const hasCycles = listed(v.cycles);
  const hasBench = present(v.bench);
  if (needs.voltageCheck === "required" && !hasVoltage) add(["voltageCheck"], "A multimeter submission needs its voltage check: at least one reading");
  if (needs.voltageCheck === "none" && hasVoltage)
    add(["voltageCheck"], "An unverified submission has no voltage check; if you measured, choose the method you used");
  if (needs.cycles && !hasCycles) add(["cycles"], "Add at least one fly-and-recharge cycle (3–5 are usual)");
  if (!needs.cycles && hasCycles) add(["cycles"], "Recharge cycles go with the fly-and-recharge method; choose that method or remove them");
  if (needs.bench && !hasBench) add(["bench"], "A bench submission needs its bench points: two or more");
  if (!needs.bench && hasBench) add(["bench"], "Bench points go with the bench clamp-meter method; choose that method or remove them");
  if (hasVoltage && !present(v.voltageScale)) add(["voltageScale"], "Enter the voltage scale your voltage check led to");
  if ((hasCycles || hasBench) && !present(v.currentScale)) add(["currentScale"], "Enter the current scale your measurements led to");
}
