import { z } from "zod";
import { benchPointSchema, type BenchWorksheet } from "@/lib/calibration";
import { quadIdField, settingInForce, type Removed, type SheetCommon } from "./common-input";

// The bench (clamp-meter) worksheet's inputs and computed view, free of server imports so the
// page's form checks with the very schemas the route handlers parse with. Each point is then
// fitted with every earlier one by lib/calibration/bench.ts on the server, where it is stored
// whole or refused.

export const benchStartInput = z.object({
  kind: z.literal("bench"),
  quadId: quadIdField,
  scaleUsed: settingInForce("The current scale in force").nullish(),
  offsetUsed: settingInForce("The current offset in force").nullish(),
});

export const benchPointInput = benchPointSchema;

export type BenchPointRow = { position: number; measuredAmps: number; reportedAmps: number };

export type BenchSheetView = SheetCommon & {
  kind: "bench";
  scaleUsed: number;
  offsetUsed: number;
  points: BenchPointRow[];
  removed: Array<Removed<BenchPointRow>>;
  result: BenchWorksheet | null;
};
