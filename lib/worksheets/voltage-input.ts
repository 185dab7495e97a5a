import { z } from "zod";
import type { VoltageWorksheet } from "@/lib/calibration";
import { cellsField, positiveNumber } from "@/lib/calibration/fields";
import { MEASURED_AT, type MeasuredAt } from "@/lib/submissions/vocabulary";
import { quadIdField, settingInForce, type Removed, type SheetCommon } from "./common-input";

// The voltage worksheet's inputs and computed view, free of server imports so the page's form
// checks with the very schemas the route handlers parse with. Each reading is then judged with
// every earlier one by lib/calibration/voltage.ts on the server, where it is stored whole or
// refused.

export const voltageStartInput = z.object({
  kind: z.literal("voltage"),
  quadId: quadIdField,
  scaleUsed: settingInForce("The voltage scale in force").nullish(),
});

export const voltageReadingInput = z.object({
  cells: cellsField(),
  reportedVolts: positiveNumber("The reported voltage", "V"),
  measuredVolts: positiveNumber("The multimeter voltage", "V"),
  measuredAt: z.enum(MEASURED_AT, { error: "Say where the multimeter touched: the main lead or the balance plug's outer pins" }),
});

export type VoltageReadingRow = { position: number; cells: number; reportedVolts: number; measuredVolts: number; measuredAt: MeasuredAt };

export type VoltageSheetView = SheetCommon & {
  kind: "voltage";
  scaleUsed: number;
  readings: VoltageReadingRow[];
  removed: Array<Removed<VoltageReadingRow>>;
  result: VoltageWorksheet | null;
};
