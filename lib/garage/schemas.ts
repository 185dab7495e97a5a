import { z } from "zod";
import { CHEMISTRIES, CHEMISTRY_LIMITS } from "@/lib/calibration/chemistry";
import { cellsField, mahField, numberField } from "@/lib/calibration/fields";
import { pastIsoDate, rowIdField } from "@/lib/input/bounds";
import { multiLine, oneLine } from "@/lib/input/text";

// The garage's input rules, shared by the route handlers and the forms (zod on both sides). Bounds
// match the CHECKs of migrations/20261209000100…300; messages name the field in plain words.

const capital = (label: string) => label.charAt(0).toUpperCase() + label.slice(1);
const text = (label: string, max: number) =>
  oneLine(
    z
      .string({ error: `Enter ${label}` })
      .trim()
      .min(1, `Enter ${label}`)
      .max(max, `Keep ${label} to ${max} characters`),
    capital(label),
  );
const optionalText = (label: string, max: number, lines: "one line" | "lines" = "one line") =>
  (lines === "one line" ? oneLine : multiLine)(
    z
      .string({ error: `${label} must be text` })
      .trim()
      .max(max, `Keep ${label} to ${max} characters`),
    capital(label),
  )
    .nullish()
    .transform((v) => (v ? v : null));
// whether the revision or family exists is checked in lib/garage/quads.ts, which reads the catalogue
const optionalId = (label: string) =>
  rowIdField(`${label} must be chosen from the list`)
    .nullish()
    .transform((v) => v ?? null);
const isoDate = pastIsoDate;

export const quadInput = z.object({
  name: text("the quad's name", 80),
  boardRevisionId: optionalId("The board revision"),
  firmwareFamilyId: optionalId("The firmware family"),
  firmwareVersion: optionalText("the firmware version", 40),
  esc: optionalText("the ESC", 120),
  notes: optionalText("the notes", 4000, "lines"),
});

export const packInput = z.object({
  label: text("the pack's label", 80),
  chemistry: z.enum(CHEMISTRIES, { error: `Choose the pack chemistry: ${CHEMISTRIES.map((c) => CHEMISTRY_LIMITS[c].label).join(", ")}` }),
  cells: cellsField(),
  ratedMah: mahField("The pack's rated mAh").int("The rated mAh is a whole number, as printed on the label"),
  purchasedOn: isoDate("The purchase date")
    .nullish()
    .transform((v) => v ?? null),
});

/** Resting volts outside 2.5–4.45 V a cell are no lithium cell at rest (our own plausibility rule). */
const RESTING_VOLTS = { min: 2.5, max: 4.45 } as const;

const chargeInput = z.object({
  chargedOn: isoDate("The charge date"),
  chargedMah: mahField("The charged mAh"),
  restingVoltsPerCell: numberField("The resting voltage per cell")
    .min(
      RESTING_VOLTS.min,
      `A resting cell reads ${RESTING_VOLTS.min}–${RESTING_VOLTS.max} V; below that the reading or the pack is bad — check the probe and stop using a pack that reads this low`,
    )
    .max(
      RESTING_VOLTS.max,
      `A resting cell reads ${RESTING_VOLTS.min}–${RESTING_VOLTS.max} V; did you enter the whole pack's voltage? Divide it by the cell count`,
    )
    .nullish()
    .transform((v) => v ?? null),
  afterFullFlight: z.boolean({ error: "Say whether the flight before this charge went to the landing voltage" }).default(true),
});

/**
 * More than half again the rated capacity put back in one charge is almost always a typo (an extra
 * digit) or a charger set for another pack: a healthy pack takes back no more than its capacity plus
 * the charger's losses (common practice, no source). Such a charge is kept only when the builder
 * says it is right.
 */
export const OVER_CAPACITY_FACTOR = 1.5;

/** What the charge rules need to know about the pack. */
export type ChargeLimits = { ratedMah: number; purchasedOn: string | null };

export const isOverCapacity = (chargedMah: unknown, ratedMah: number) => typeof chargedMah === "number" && chargedMah > OVER_CAPACITY_FACTOR * ratedMah;

/**
 * A charge of one pack: the shared rules, a date no earlier than the pack's purchase, and above
 * 150 % of the rated capacity only with confirmOverCapacity ticked. The form and the server both
 * build it from the pack, so the same words land under the same field.
 */
export function chargeInputFor(pack: ChargeLimits) {
  return chargeInput
    .extend({ confirmOverCapacity: z.boolean({ error: "Say whether the large charge is right: yes or no" }).default(false) })
    .superRefine((c, ctx) => {
      if (pack.purchasedOn && c.chargedOn < pack.purchasedOn) {
        ctx.addIssue({
          code: "custom",
          path: ["chargedOn"],
          message: `The charge date cannot be before the pack's purchase date (${pack.purchasedOn})`,
        });
      }
      if (isOverCapacity(c.chargedMah, pack.ratedMah) && !c.confirmOverCapacity) {
        ctx.addIssue({
          code: "custom",
          path: ["chargedMah"],
          message: `${c.chargedMah} mAh is more than 150 % of this pack's rated ${pack.ratedMah} mAh: check the figure, or tick "Yes, this is right" to keep it`,
        });
      }
    });
}
