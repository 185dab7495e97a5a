import { z } from "zod";
import { BOARD_KINDS, METHODS } from "@/lib/vocabulary";

// GET /api/v1/boards/{slug}/values: its query parameters and its response body. The body's type
// must accept lib/published's BoardValues (checked at compile time in lib/published/api-response.ts).

const SLUG_RE = /^[a-z0-9]+(-[a-z0-9]+)*$/;
const iso = z.iso.datetime({ offset: true }).meta({ description: "ISO 8601 date and time, UTC." });

export const ValuesQuerySchema = z.object({
  revision: z
    .string()
    .trim()
    .max(40, "revision must be at most 40 characters (a revision label, like v2)")
    .optional()
    .meta({ description: "Only this revision, by its label (case does not matter), e.g. v2." }),
  family: z
    .string()
    .trim()
    .max(60, "family must be at most 60 characters")
    .regex(SLUG_RE, "family must be a firmware family slug: lower-case letters, digits and single hyphens")
    .optional()
    .meta({ description: "Only this firmware family, by slug." }),
  points: z
    .enum(["0", "1", "true", "false"], { error: "points must be 1 or 0 (or true or false)" })
    .transform((v) => v === "1" || v === "true")
    .optional()
    .meta({ description: "1 adds each quantity's approved values with their outlier flags." }),
});

export type ValuesQuery = z.output<typeof ValuesQuerySchema>;

const methodEnum = z.enum(METHODS);

const ValuePointSchema = z
  .object({
    value: z.number().meta({ description: "The setting as submitted, in steps of the family's unit." }),
    method: methodEnum,
    date: iso.meta({ description: "When the submission last changed." }),
    outlier: z.boolean().meta({ description: "|modifiedZ| > 3.5 (NIST/SEMATECH e-Handbook 1.3.5.17); when MAD = 0 see modifiedZ." }),
    modifiedZ: z.number().nullable().meta({
      description:
        "0.6745 (x − median) / MAD; with MAD = 0, (x − median) / (1.253314 · mean absolute deviation). Null below 3 values or with no spread at all.",
    }),
  })
  .meta({ id: "ValuePoint" });

const QuantityValuesSchema = z
  .object({
    n: z.number().int().meta({ description: "Approved values behind these figures." }),
    median: z.number(),
    q1: z.number().meta({ description: "First quartile, Hyndman–Fan type 7." }),
    q3: z.number(),
    iqr: z.number(),
    mad: z.number().meta({ description: "Median absolute deviation, unscaled." }),
    scaledMad: z.number().meta({ description: "MAD × 1.4826." }),
    ciLow: z.number().nullable().meta({ description: "Lower end of the distribution-free interval for the median; null below 6 values." }),
    ciHigh: z.number().nullable(),
    ciCoverage: z.number().nullable().meta({ description: "The interval's exact coverage (at least 0.95)." }),
    outlierCount: z.number().int().meta({ description: "Values flagged by the modified z-score." }),
    tukeyCount: z.number().int().meta({ description: "Values beyond Tukey's inner fences (1.5 IQR)." }),
    methodCounts: z.partialRecord(methodEnum, z.number().int()).meta({ description: "Approved values per calibration method." }),
    recommended: z.object({
      setting: z.number().int().meta({ description: "The whole number to enter in the firmware." }),
      value: z.number().meta({ description: "What that setting stands for: setting × step." }),
      unit: z.string(),
      step: z.number(),
    }),
    confidence: z.object({
      label: z.enum(["strong", "fair", "weak", "too_few"]),
      title: z.string(),
      explanation: z.string(),
    }),
    lastChangeAt: iso.meta({ description: "The newest change among the approved values." }),
    computedAt: iso,
    points: z.array(ValuePointSchema).optional().meta({ description: "Only with points=1; oldest first." }),
  })
  .meta({
    id: "QuantityValues",
    description: "Statistics of one setting; every figure is in setting steps. Null when nobody has calibrated this setting yet.",
  });

// Null when nobody has calibrated this setting yet. No .meta() here: it would inline the schema
// instead of referencing it. (zod-to-openapi marks the QuantityValues component itself nullable
// because its first use is nullable; that holds as long as every use is.)
const quantity = QuantityValuesSchema.nullable();

const GroupValuesSchema = z
  .object({
    family: z.string().meta({ description: "Firmware family slug; see families for its units." }),
    lastChangeAt: iso,
    voltageScale: quantity,
    currentScale: quantity,
    currentOffset: quantity,
  })
  .meta({ id: "GroupValues", description: "One revision under one firmware family." });

const scaleUnits = <U extends readonly [string, ...string[]]>(units: U) =>
  z.object({
    unit: z.enum(units),
    step: z.number().meta({ description: "What one setting step is worth in unit." }),
    response: z
      .enum(["proportional", "inverse"])
      .meta({ description: "Whether the displayed reading grows (proportional) or shrinks (inverse) as the setting grows." }),
    min: z.number().meta({ description: "Smallest setting the firmware accepts, in steps." }),
    max: z.number(),
  });

const FamilyUnitsSchema = z
  .object({
    slug: z.string(),
    name: z.string(),
    description: z.string().nullable(),
    voltageScale: scaleUnits(["V/V", "mV/V"] as const).meta({
      description: "V/V: divider ratio (pack volts per ADC-pin volt); mV/V: millivolts at the ADC pin per pack volt.",
    }),
    currentScale: scaleUnits(["mV/A", "A/V"] as const).meta({
      description: "mV/A: sensor output per amp; A/V: amps per volt of sensor output.",
    }),
    currentOffset: z.object({ unit: z.enum(["mV", "mA"]), step: z.number(), min: z.number(), max: z.number() }),
  })
  .meta({ id: "FamilyUnits", description: "How to read a firmware family's settings: value = setting × step, in unit." });

export const BoardValuesResponseSchema = z
  .object({
    board: z.object({
      slug: z.string(),
      name: z.string(),
      kind: z.enum(BOARD_KINDS),
      manufacturer: z.object({ slug: z.string(), name: z.string() }),
    }),
    families: z.array(FamilyUnitsSchema),
    revisions: z.array(
      z.object({
        id: z.number().int(),
        label: z.string(),
        position: z.number().int(),
        families: z.array(GroupValuesSchema).meta({ description: "Only families with at least one approved value." }),
      }),
    ),
    lastChangeAt: iso.nullable().meta({ description: "The newest change of any group shown; null when nothing is published." }),
  })
  .meta({ id: "BoardValues", description: "Published values per revision and firmware family." });

export type BoardValuesResponse = z.infer<typeof BoardValuesResponseSchema>;
