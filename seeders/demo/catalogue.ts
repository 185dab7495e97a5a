import { currentScaleSettingFromSensitivity, voltageScaleSettingFromRatio } from "@/lib/calibration/units";
import type { BoardKind } from "@/lib/vocabulary";
import { DEMO_BOARDS, type BoardSpec, type PopularityTier } from "./boards";
import type { DemoFirmwareFamily } from "./firmware-families";
import { physicalTruth, publishedHardware, type PhysicalTruth, type PublishedHardware } from "./hardware";
import { createRng } from "./random";
import { isoDate, monthsBefore } from "./timeline";

export type DemoBoardModel = {
  slug: string;
  manufacturerSlug: string;
  name: string;
  kind: BoardKind;
  mountingPattern: string;
  minCells: number;
  maxCells: number;
  description: string | null;
  tier: PopularityTier;
};

export type DemoBoardRevision = PublishedHardware & {
  /** `${boardSlug}@${label}`: how the rest of the scenario refers to a revision before it has an id */
  key: string;
  boardSlug: string;
  label: string;
  position: number;
  releasedOn: string;
  notes: string | null;
  /** set for the deliberately sparse revisions */
  fixedSubmissionCount: number | null;
};

export type DemoBoardAlias = { boardSlug: string; alias: string };

/** The exact (unrounded) settings a perfect calibration would give, per firmware family slug. */
export type TrueSettings = { voltageScale: number; currentScale: number; currentOffset: number };
export type DemoTruth = { revisionKey: string; physical: PhysicalTruth; settings: Record<string, TrueSettings> };

export type DemoCatalogue = {
  boardModels: DemoBoardModel[];
  boardRevisions: DemoBoardRevision[];
  boardAliases: DemoBoardAlias[];
  truths: DemoTruth[];
};

function slugify(name: string): string {
  return name
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "");
}

const revisionKey = (boardSlug: string, label: string) => `${boardSlug}@${label}`;

const KIND_WORDS: Record<BoardKind, string> = {
  flight_controller: "Flight controller",
  aio: "All-in-one flight controller and ESC",
  esc_4in1: "4-in-1 ESC",
  pdb: "Power distribution board",
  power_module: "Power module",
};

function describe(spec: BoardSpec, index: number): string | null {
  if (spec.description) return spec.description;
  if (index % 4 === 3) return null; // some makers publish nothing worth repeating
  return `${KIND_WORDS[spec.kind]} for ${spec.minCells}–${spec.maxCells}S packs, ${spec.mounting} mm mounting.`;
}

/**
 * The current offset that cancels a sensor's zero error, in the family's unit. This is the demo's
 * own convention (offset = the error, in mV at the sensor or in mA of reading); it only has to be
 * consistent inside the scenario.
 */
export function offsetSetting(truth: PhysicalTruth, family: DemoFirmwareFamily): number {
  const inUnit = family.currentOffsetUnit === "mV" ? truth.zeroErrorMv : (truth.zeroErrorMv / truth.sensitivityMvPerAmp) * 1000;
  return inUnit / family.currentOffsetStep;
}

function trueSettingsFor(truth: PhysicalTruth, family: DemoFirmwareFamily): TrueSettings {
  return {
    voltageScale: voltageScaleSettingFromRatio(truth.ratio, family),
    currentScale: currentScaleSettingFromSensitivity(truth.sensitivityMvPerAmp, family),
    currentOffset: offsetSetting(truth, family),
  };
}

export function buildDemoCatalogue(families: readonly DemoFirmwareFamily[], anchor: Date, seed: number, boards = DEMO_BOARDS): DemoCatalogue {
  const rng = createRng(seed);
  const out: DemoCatalogue = { boardModels: [], boardRevisions: [], boardAliases: [], truths: [] };

  boards.forEach((spec, index) => {
    const slug = slugify(spec.name);
    out.boardModels.push({
      slug,
      manufacturerSlug: spec.maker,
      name: spec.name,
      kind: spec.kind,
      mountingPattern: spec.mounting,
      minCells: spec.minCells,
      maxCells: spec.maxCells,
      description: describe(spec, index),
      tier: spec.tier,
    });
    for (const alias of spec.aliases) out.boardAliases.push({ boardSlug: slug, alias });

    spec.revisions.forEach((r, position) => {
      const hw = publishedHardware(r);
      const key = revisionKey(slug, r.label);
      out.boardRevisions.push({
        key,
        boardSlug: slug,
        label: r.label,
        position,
        releasedOn: isoDate(monthsBefore(anchor, r.monthsAgo)),
        notes: r.notes ?? null,
        fixedSubmissionCount: r.submissions ?? null,
        ...hw,
      });
      const physical = physicalTruth(hw, spec.maxCells, rng);
      out.truths.push({
        revisionKey: key,
        physical,
        settings: Object.fromEntries(families.map((f) => [f.slug, trueSettingsFor(physical, f)])),
      });
    });
  });
  return out;
}
