import { z } from "zod";
import type { FieldIssue, RechargeWorksheet } from "@/lib/calibration";
import { cellsField, mahField, numberField } from "@/lib/calibration/fields";
import { quadIdField, type Removed } from "./common-input";

// The fly-and-recharge worksheet's inputs and its computed view, free of server imports so the
// page's form checks with the very schema the route handler uses.

export const startInput = z.object({
  quadId: quadIdField,
  /** The garage pack the figures came from, if any: remembered so that pack is archived, not deleted, once the worksheet is published. */
  packId: z
    .number({ error: "Choose the pack from the list" })
    .int()
    .positive("Choose the pack from the list")
    .nullish()
    .transform((v) => v ?? null),
  ratedMah: mahField("The pack's rated mAh").int("The rated mAh is a whole number, as printed on the label"),
  cells: cellsField(),
  startingScale: numberField("The starting current scale")
    .int("A setting is a whole number")
    .positive("The starting current scale must be more than 0")
    .nullish(),
});

export const stepInput = z.object({
  scaleUsed: numberField("The current scale flown with").int("A setting is a whole number"),
  reportedMah: mahField("The reported mAh"),
  chargedMah: mahField("The charged mAh"),
  fullyRecharged: z.boolean({ error: "Say whether the charger finished: yes or no" }).default(true),
});

export type RechargeStepRow = { position: number; scaleUsed: number; reportedMah: number; chargedMah: number; fullyRecharged: boolean };

export type WorksheetView = {
  kind: "fly_recharge";
  id: number;
  quadId: number;
  quadName: string;
  familyName: string;
  ratedMah: number;
  cells: number;
  startingScale: number;
  startingSource: "published" | "own";
  steps: RechargeStepRow[];
  /** Iterations the builder took back: kept and shown, never counted or published. */
  removed: Array<Removed<RechargeStepRow>>;
  result: RechargeWorksheet | null;
  warnings: FieldIssue[];
  submissionId: number | null;
};
