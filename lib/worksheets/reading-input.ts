import { z } from "zod";
import type { BenchWorksheet, FieldIssue, VoltageWorksheet } from "@/lib/calibration";
import { benchPointSchema } from "@/lib/calibration/bench";
import { cellsField, numberField, positiveNumber } from "@/lib/calibration/fields";
import { MEASURED_AT, type MeasuredAt } from "@/lib/submissions/vocabulary";

// The voltage and bench worksheets' inputs and computed views, free of server imports so the
// pages' forms check with the very schemas the route handlers parse with. Each reading or point is
// then judged with every earlier one by lib/calibration (voltage.ts, bench.ts) on the
// server, where it is stored whole or refused.

const quadId = z.number({ error: "Choose the quad" }).int().positive("Choose the quad");
// the family's range is checked on the server, which knows the quad's family
const setting = (label: string) => numberField(label).int("A setting is a whole number");

export const voltageStartInput = z.object({
  kind: z.literal("voltage"),
  quadId,
  scaleUsed: setting("The voltage scale in force").nullish(),
});

export const benchStartInput = z.object({
  kind: z.literal("bench"),
  quadId,
  scaleUsed: setting("The current scale in force").nullish(),
  offsetUsed: setting("The current offset in force").nullish(),
});

export const voltageReadingInput = z.object({
  cells: cellsField(),
  reportedVolts: positiveNumber("The reported voltage", "V"),
  measuredVolts: positiveNumber("The multimeter voltage", "V"),
  measuredAt: z.enum(MEASURED_AT, { error: "Say where the multimeter touched: the main lead or the balance plug's outer pins" }),
});

export const benchPointInput = benchPointSchema;

export type VoltageReadingRow = { position: number; cells: number; reportedVolts: number; measuredVolts: number; measuredAt: MeasuredAt };
export type BenchPointRow = { position: number; measuredAmps: number; reportedAmps: number };
/** A reading or point the builder took back: kept and shown, never counted or published. */
export type Removed<T> = T & { removedAt: string };

type SheetCommon = {
  id: number;
  quadId: number;
  quadName: string;
  familyName: string;
  startingSource: "published" | "own";
  warnings: FieldIssue[];
  submissionId: number | null;
  createdAt: string;
};

export type VoltageSheetView = SheetCommon & {
  kind: "voltage";
  scaleUsed: number;
  readings: VoltageReadingRow[];
  removed: Array<Removed<VoltageReadingRow>>;
  result: VoltageWorksheet | null;
};

export type BenchSheetView = SheetCommon & {
  kind: "bench";
  scaleUsed: number;
  offsetUsed: number;
  points: BenchPointRow[];
  removed: Array<Removed<BenchPointRow>>;
  result: BenchWorksheet | null;
};

/** What removing the last reading or point answers: the worksheet after, and what was taken back. */
export type RemovedAnswer<V, R> = { worksheet: V; removed: R };

/** "Publish to Shuntbook": both optional; the quad's firmware version is used when none is sent. */
export const publishInput = z.object(
  {
    firmwareVersion: z.string({ error: "The firmware version is text, like 4.5.0" }).trim().nullish().transform((v) => (v ? v : null)),
    notes: z.string({ error: "Notes are text" }).nullish().transform((v) => (v && v.trim() ? v : null)),
  },
  { error: "Send the publish request as one JSON object (it may be empty)" },
);

/** How the garage names each kind of worksheet and what it holds. */
export const WORKSHEET_LABELS = {
  fly_recharge: { title: "Fly-and-recharge", entries: "iterations" },
  voltage: { title: "Voltage check", entries: "readings" },
  bench: { title: "Bench current check", entries: "points" },
} as const;
