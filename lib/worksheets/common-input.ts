import { z } from "zod";
import type { FieldIssue } from "@/lib/calibration";
import { numberField } from "@/lib/calibration/fields";

// What the worksheet kinds' inputs and views share, free of server imports so the pages' forms
// check with the very schemas the route handlers parse with.

export const quadIdField = z.number({ error: "Choose the quad" }).int().positive("Choose the quad");

/** A setting in force as typed; the family's range is checked on the server, which knows the quad's family. */
export const settingInForce = (label: string) => numberField(label).int("A setting is a whole number");

/** A reading or point the builder took back: kept and shown, never counted or published. */
export type Removed<T> = T & { removedAt: string };

/** What the voltage and bench worksheets' views share. */
export type SheetCommon = {
  id: number;
  quadId: number;
  quadName: string;
  familyName: string;
  startingSource: "published" | "own";
  warnings: FieldIssue[];
  submissionId: number | null;
  createdAt: string;
};

/** How the garage names each kind of worksheet and what it holds. */
export const WORKSHEET_LABELS = {
  fly_recharge: { title: "Fly-and-recharge", entries: "iterations" },
  voltage: { title: "Voltage check", entries: "readings" },
  bench: { title: "Bench current check", entries: "points" },
} as const;
