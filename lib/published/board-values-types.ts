import type { BoardKind, ConfidenceLabel, CurrentOffsetUnit, CurrentScaleUnit, Method, Quantity, Response, VoltageScaleUnit } from "@/lib/vocabulary";

// The published values of one board, as the board page and GET /api/v1/boards/{slug}/values read
// them. Plain JSON data (dates as ISO strings) so that one object can be cached, filtered and
// serialised without conversion. Every setting is a count of the family's step (see FamilyUnits).

/** One approved value with its outlier flag, from lib/stats flagPoints over the group's values. */
export type ValuePoint = {
  /** The setting as submitted, in steps. */
  value: number;
  method: Method;
  /** When the submission last changed (ISO 8601). */
  date: string;
  /** |modifiedZ| > 3.5 (NIST/SEMATECH e-Handbook §1.3.5.17), with lib/stats' rules for MAD = 0. */
  outlier: boolean;
  /** Null with fewer than 3 values, or when there is no spread to divide by. */
  modifiedZ: number | null;
};

/** board_stats for one quantity of one group, in API field names, plus what a reader needs to use it. */
export type QuantityValues = {
  n: number;
  median: number;
  q1: number;
  q3: number;
  iqr: number;
  /** Unscaled median absolute deviation. */
  mad: number;
  /** MAD × 1.4826, an estimate of σ for normal data. */
  scaledMad: number;
  /** Distribution-free interval for the median; null below 6 values. */
  ciLow: number | null;
  ciHigh: number | null;
  ciCoverage: number | null;
  outlierCount: number;
  tukeyCount: number;
  methodCounts: Partial<Record<Method, number>>;
  /** The median as a whole setting, and the value that setting stands for in the family's unit. */
  recommended: { setting: number; value: number; unit: string; step: number };
  confidence: { label: ConfidenceLabel; title: string; explanation: string };
  /** The newest change among the approved values behind these figures (ISO 8601). */
  lastChangeAt: string;
  /** When the figures were computed (ISO 8601). */
  computedAt: string;
  /** Present only when asked for (points=1). */
  points?: ValuePoint[];
};

/** API names of the three settings, in the order they are shown. */
export const QUANTITY_KEYS = { voltage_scale: "voltageScale", current_scale: "currentScale", current_offset: "currentOffset" } as const satisfies Record<
  Quantity,
  string
>;
export type QuantityKey = (typeof QUANTITY_KEYS)[Quantity];

/** One (revision, firmware family) group; a quantity nobody has calibrated yet is null. */
export type GroupValues = {
  /** Slug of the firmware family; its unit definition is in BoardValues.families. */
  family: string;
  lastChangeAt: string;
} & Record<QuantityKey, QuantityValues | null>;

export type RevisionValues = {
  id: number;
  label: string;
  position: number;
  /** Groups with at least one approved value, by family name. */
  families: GroupValues[];
};

type ScaleUnits<U extends string> = {
  unit: U;
  /** What one setting step is worth in `unit`: value = setting × step. */
  step: number;
  /** "proportional": the displayed reading grows with the setting; "inverse": it shrinks. */
  response: Response;
  /** The settings the firmware accepts, in steps. */
  min: number;
  max: number;
};

/** How to read a family's settings (migrations/20261202000600-create-firmware-families.ts). */
export type FamilyUnits = {
  slug: string;
  name: string;
  description: string | null;
  voltageScale: ScaleUnits<VoltageScaleUnit>;
  currentScale: ScaleUnits<CurrentScaleUnit>;
  currentOffset: { unit: CurrentOffsetUnit; step: number; min: number; max: number };
};

export type BoardValues = {
  board: { slug: string; name: string; kind: BoardKind; manufacturer: { slug: string; name: string } };
  /** The families that appear in `revisions` (or the one asked for). */
  families: FamilyUnits[];
  revisions: RevisionValues[];
  /** The newest lastChangeAt of any group shown; null when nothing is published yet. */
  lastChangeAt: string | null;
};

/** What a reader may narrow the values to. */
export type BoardValuesFilter = {
  /** A revision label of this board, compared without regard to case. */
  revision?: string;
  /** A firmware family slug. */
  family?: string;
  /** Include each group's approved values with their flags. */
  points?: boolean;
};
