import { z } from "zod";
import { CATALOGUE_SORTS } from "@/lib/catalogue/search-params";
import { BOARD_KINDS } from "@/lib/vocabulary";

// Response bodies of GET /api/v1/boards and GET /api/v1/boards/{slug}. The handlers' output is
// typed by these schemas (lib/catalogue/api-response.ts) and the OpenAPI document is generated from
// them, so the document cannot drift from what is sent.

const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/)
  .meta({ description: "A calendar date, YYYY-MM-DD." });

const BoardLinksSchema = z.object({
  self: z.string().meta({ example: "/api/v1/boards/example-f7" }),
  values: z.string().meta({ example: "/api/v1/boards/example-f7/values" }),
  page: z.string().meta({ description: "The board's page on the site.", example: "/boards/example-f7" }),
});

const ManufacturerRefSchema = z.object({ slug: z.string(), name: z.string() });

const BoardSummarySchema = z
  .object({
    slug: z.string(),
    name: z.string(),
    kind: z.enum(BOARD_KINDS),
    mountingPattern: z.string().meta({ description: "Hole spacing in millimetres.", example: "30.5x30.5" }),
    minCells: z.number().int(),
    maxCells: z.number().int(),
    manufacturer: ManufacturerRefSchema,
    revisionCount: z.number().int(),
    approvedCount: z.number().int().meta({ description: "Approved submissions over all revisions and families." }),
    latestReleasedOn: isoDate.nullable().meta({ description: "Release date of the newest revision, when known." }),
    score: z.number().nullable().meta({ description: "How well the board matched q, 0–1; null without q." }),
    links: BoardLinksSchema,
  })
  .meta({ id: "BoardSummary" });

export const BoardListResponseSchema = z
  .object({
    boards: z.array(BoardSummarySchema),
    query: z
      .object({
        q: z.string().nullable(),
        kind: z.enum(BOARD_KINDS).nullable(),
        mounting: z.string().nullable(),
        sort: z.enum(CATALOGUE_SORTS),
        page: z.number().int(),
        pageSize: z.number().int(),
      })
      .meta({ description: "The parameters as understood, defaults filled in." }),
    total: z.number().int(),
    pageCount: z.number().int(),
    links: z.object({
      self: z.string(),
      next: z.string().nullable(),
      prev: z.string().nullable(),
    }),
  })
  .meta({ id: "BoardList", description: "One page of the catalogue." });

const RevisionDetailSchema = z
  .object({
    id: z.number().int(),
    label: z.string().meta({ example: "v2" }),
    position: z.number().int(),
    releasedOn: isoDate.nullable(),
    dividerTopOhms: z.number().nullable(),
    dividerBottomOhms: z.number().nullable(),
    dividerRatio: z.number().nullable().meta({ description: "Pack volts per ADC-pin volt, (top + bottom) / bottom." }),
    currentSensor: z.enum(["shunt", "hall"]).nullable(),
    shuntMilliohms: z.number().nullable(),
    amplifierGain: z.number().nullable(),
    hallMvPerAmp: z.number().nullable(),
    sensitivityMvPerAmp: z.number().nullable().meta({ description: "Sensor output per amp: shunt × gain, or the Hall figure." }),
    adcBits: z.number().int().nullable(),
    adcReferenceVolts: z.number().nullable(),
    notes: z.string().nullable(),
    approvedCount: z.number().int(),
  })
  .meta({ id: "RevisionDetail", description: "A revision's sensor hardware; null means not known." });

export const BoardDetailResponseSchema = z
  .object({
    slug: z.string(),
    name: z.string(),
    kind: z.enum(BOARD_KINDS),
    mountingPattern: z.string(),
    minCells: z.number().int(),
    maxCells: z.number().int(),
    description: z.string().nullable(),
    manufacturer: ManufacturerRefSchema.extend({ website: z.string().nullable() }),
    aliases: z.array(z.string()),
    revisions: z.array(RevisionDetailSchema),
    links: BoardLinksSchema,
  })
  .meta({ id: "BoardDetail", description: "One board with every revision's sensor hardware." });

export type BoardListResponse = z.infer<typeof BoardListResponseSchema>;
export type BoardDetailResponse = z.infer<typeof BoardDetailResponseSchema>;
