import { z } from "zod";
import { formatFigure } from "@/lib/catalogue/format";
import { medianOfSorted, sortedCopy } from "@/lib/stats";
import { CHARGING_CAUTIONS, type Caution } from "./cautions";
import { CHEMISTRIES, CHEMISTRY_LIMITS, type Chemistry, type ChemistryLimits } from "./chemistry";
import { cellsField, mahField, numberField } from "./fields";
import { failed, ok, parseInput, type FieldIssue, type WorksheetResult } from "./result";
import { SOURCES } from "./sources";

// When to land with one pack: a used-capacity alert (consumed mAh) and "land soon" / "land now"
// voltages per cell for its chemistry, from its rating or, better, from what the charger has been
// putting back. The builder copies these figures into their own OSD.

/** Alert at 80 % of usable capacity (common practice, no source). */
export const USED_CAPACITY_ALERT_FRACTION = 0.8;
/** The estimate is the median of the last 5 charges after full flights, once there are 3 (our own rule). */
const RECENT_CHARGES = 5;
const MIN_CHARGES_FOR_ESTIMATE = 3;
/** A charge-log estimate this far over the rating means the charger or the label is off (our own rule). */
const ESTIMATE_OVER_RATED_WARNING = 0.1;

export type PackLandingGuideInput = {
  chemistry: Chemistry;
  cells: number;
  ratedMah: number;
  /** Oldest first. afterFullFlight: the pack was flown to the landing voltage before this charge. */
  chargeLog?: ReadonlyArray<{ chargedMah: number; afterFullFlight: boolean }> | null;
  /** Charge cycles the pack has had in all, when the log does not go back to its first. */
  cycleCount?: number | null;
};

type Volts = { perCell: number; pack: number; source: string };

export type PackLandingGuide = {
  chemistry: Chemistry;
  label: string;
  cells: number;
  capacity: {
    ratedMah: number;
    /** Median of recent charges after full flights, or null with too few of them. */
    estimatedUsableMah: number | null;
    chargesUsed: number;
    /** What the used-capacity alert is set from: the smaller of the estimate and the rating, the safe side. */
    basisMah: number;
    basis: "charge log" | "rating";
    cycleCount: number;
  };
  /** The used-capacity alert in consumed mAh, rounded down to a whole mAh so that it comes early rather than late. */
  usedCapacityAlert: { mah: number; fraction: number; source: string };
  /** Read under load: "land soon" at the top of the landing range, "land now" at its bottom. */
  landSoon: Volts;
  landNow: Volts;
  /** The chemistry's limits per cell, and for the whole pack. */
  limits: ChemistryLimits;
  full: Volts;
  cautions: readonly Caution[];
};

const schema = z.object({
  chemistry: z.enum(CHEMISTRIES, { error: `Choose the pack chemistry: ${CHEMISTRIES.map((c) => CHEMISTRY_LIMITS[c].label).join(", ")}` }),
  cells: cellsField(),
  ratedMah: mahField("The pack's rated mAh"),
  chargeLog: z
    .array(
      z.object({
        chargedMah: mahField("The charged mAh"),
        afterFullFlight: z.boolean({ error: "Say whether the flight before this charge went to the landing voltage" }),
      }),
    )
    .max(1000, "At most 1000 charges")
    .nullish(),
  cycleCount: numberField("The cycle count").int("The cycle count is a whole number").min(0, "The cycle count cannot be negative").nullish(),
});

const volts = (perCell: number, cells: number, source: string): Volts => ({ perCell, pack: perCell * cells, source });

export function packLandingGuide(input: PackLandingGuideInput): WorksheetResult<PackLandingGuide> {
  const parsed = parseInput(schema, input);
  if ("errors" in parsed) return failed(parsed.errors);
  const { chemistry, cells, ratedMah, chargeLog, cycleCount } = parsed.data;
  const log = chargeLog ?? [];
  const warnings: FieldIssue[] = [];

  const recent = log
    .filter((c) => c.afterFullFlight)
    .slice(-RECENT_CHARGES)
    .map((c) => c.chargedMah);
  const estimate = recent.length >= MIN_CHARGES_FOR_ESTIMATE ? medianOfSorted(sortedCopy(recent))! : null;
  if (log.length > 0 && estimate == null) {
    warnings.push({ field: "chargeLog", message: `Fewer than ${MIN_CHARGES_FOR_ESTIMATE} charges after full flights, so the rating is used` });
  }
  if (estimate != null && estimate > (1 + ESTIMATE_OVER_RATED_WARNING) * ratedMah) {
    warnings.push({
      field: "chargeLog",
      message: `After full flights the charger puts back ${formatFigure(estimate, 0)} mAh, more than ${ESTIMATE_OVER_RATED_WARNING * 100} % over the ${ratedMah} mAh rating: check the charger's count; the rating is used`,
    });
  }
  if (cycleCount != null && cycleCount < log.length) {
    warnings.push({
      field: "cycleCount",
      message: `The log already has ${log.length} charges, more than the ${cycleCount} cycles given: the log's count is used`,
    });
  }
  const basisMah = estimate == null ? ratedMah : Math.min(estimate, ratedMah);
  const limits = CHEMISTRY_LIMITS[chemistry];

  return ok(
    {
      chemistry,
      label: limits.label,
      cells,
      capacity: {
        ratedMah,
        estimatedUsableMah: estimate,
        chargesUsed: estimate == null ? 0 : recent.length,
        basisMah,
        basis: estimate != null && estimate < ratedMah ? "charge log" : "rating",
        cycleCount: Math.max(cycleCount ?? 0, log.length),
      },
      usedCapacityAlert: { mah: Math.floor(USED_CAPACITY_ALERT_FRACTION * basisMah), fraction: USED_CAPACITY_ALERT_FRACTION, source: SOURCES.commonPractice },
      landSoon: volts(limits.landUnderLoad.high, cells, limits.landUnderLoad.source),
      landNow: volts(limits.landUnderLoad.low, cells, limits.landUnderLoad.source),
      limits,
      full: volts(limits.full.volts, cells, limits.full.source),
      cautions: CHARGING_CAUTIONS,
    },
    warnings,
  );
}
