import { OpenAPIRegistry, OpenApiGeneratorV3 } from "@asteasolutions/zod-to-openapi";
import type { OpenAPIObject } from "openapi3-ts/oas30";
import { z } from "zod";
import { CatalogueParamsSchema, DEFAULT_PAGE_SIZE, MAX_PAGE, MAX_PAGE_SIZE, QUERY_MAX_LENGTH } from "@/lib/catalogue/search-params";
import { etagOf } from "./etag";
import { BoardDetailResponseSchema, BoardListResponseSchema } from "./schemas/boards";
import { ErrorBodySchema } from "./schemas/error";
import { BoardValuesResponseSchema, ValuesQuerySchema } from "./schemas/values";

// The OpenAPI 3 document of /api/v1, generated from the same zod schemas that parse the requests
// (lib/catalogue/search-params.ts, lib/api/schemas/values.ts) and type the responses
// (lib/api/schemas/*). Served at /api/v1/openapi.json and rendered at /api-docs.

export const API_VERSION = "1.0.0";

// Parameter descriptions for the catalogue's own schema. They are attached to copies of its fields
// here, because that schema belongs to lib/catalogue and carries no documentation of its own; the
// rules (types, patterns, limits) are still the catalogue's.
const CATALOGUE_PARAM_DOCS: Record<keyof typeof CatalogueParamsSchema.shape, string> = {
  q: `Search text matched against board names, other names and makers, misspellings allowed; at most ${QUERY_MAX_LENGTH} characters.`,
  kind: "Only boards of this kind.",
  mounting: "Only boards with this hole spacing in millimetres, like 20x20 or 30.5x30.5.",
  sort: "Order of the results. Default: relevance when q is given, otherwise name.",
  page: `Page number, 1 to ${MAX_PAGE}. Default 1.`,
  pageSize: `Boards per page, 1 to ${MAX_PAGE_SIZE}. Default ${DEFAULT_PAGE_SIZE}.`,
};

const documentedCatalogueParams = CatalogueParamsSchema.extend(
  Object.fromEntries(
    Object.entries(CatalogueParamsSchema.shape).map(([name, field]) => [name, field.meta({ description: CATALOGUE_PARAM_DOCS[name as keyof typeof CATALOGUE_PARAM_DOCS] })]),
  ) as typeof CatalogueParamsSchema.shape,
);

const slugParam = z.object({
  slug: z.string().meta({ description: "The board's slug, as in its page address.", example: "example-f7" }),
});

const readHeaders = z.object({
  ETag: z.string().meta({ description: "Send it back as If-None-Match to get a 304 when nothing changed." }),
  "Cache-Control": z.string().meta({ example: "public, max-age=60, stale-while-revalidate=300" }),
});

const conditional = z.object({
  "If-None-Match": z.string().optional().meta({ description: "An ETag from an earlier response; 304 when it still matches." }),
});

const json = (schema: z.ZodType) => ({ "application/json": { schema } });
const error = (description: string) => ({ description, content: json(ErrorBodySchema) });
const notModified = { description: "Not modified: the ETag sent in If-None-Match is still current. No body.", headers: readHeaders };

function buildDocument(): OpenAPIObject {
  const registry = new OpenAPIRegistry();

  registry.registerPath({
    method: "get",
    path: "/boards",
    operationId: "listBoards",
    summary: "Search and list boards",
    description: "The catalogue, one page at a time. The same parameters as the /boards page; unknown parameters are ignored, and an empty value counts as absent.",
    request: { query: documentedCatalogueParams, headers: conditional },
    responses: {
      200: { description: "One page of boards.", headers: readHeaders, content: json(BoardListResponseSchema) },
      304: notModified,
      400: error("A parameter is not a valid value; fieldErrors names it."),
      500: error("Unexpected server error (logged)."),
      503: error("The database is unreachable; try again."),
    },
  });

  registry.registerPath({
    method: "get",
    path: "/boards/{slug}",
    operationId: "getBoard",
    summary: "One board with its revisions' sensor hardware",
    request: { params: slugParam, headers: conditional },
    responses: {
      200: { description: "The board.", headers: readHeaders, content: json(BoardDetailResponseSchema) },
      304: notModified,
      404: error("No board has this slug."),
      500: error("Unexpected server error (logged)."),
      503: error("The database is unreachable; try again."),
    },
  });

  registry.registerPath({
    method: "get",
    path: "/boards/{slug}/values",
    operationId: "getBoardValues",
    summary: "Published calibration values per revision and firmware family",
    description:
      "For each revision and firmware family with approved values: the recommended setting, n, median, quartiles, MAD, a distribution-free 95 % interval for the median, outlier counts, a confidence label and when the values last changed. Every figure is a firmware setting in steps; families[] says what a step is worth. Community values: measure your own board before you fly with them.",
    request: { params: slugParam, query: ValuesQuerySchema, headers: conditional },
    responses: {
      200: { description: "The values.", headers: readHeaders, content: json(BoardValuesResponseSchema) },
      304: notModified,
      400: error("A parameter is not a valid value; fieldErrors names it."),
      404: error("No board has this slug, or the revision or family asked for does not exist (fieldErrors says which)."),
      500: error("Unexpected server error (logged)."),
      503: error("The database is unreachable; try again."),
    },
  });

  registry.registerPath({
    method: "get",
    path: "/openapi.json",
    operationId: "getOpenApiDocument",
    summary: "This document",
    request: { headers: conditional },
    responses: {
      200: { description: "The OpenAPI 3 document of this API.", headers: readHeaders, content: { "application/json": { schema: { type: "object" } } } },
      304: notModified,
    },
  });

  return new OpenApiGeneratorV3(registry.definitions).generateDocument({
    openapi: "3.0.3",
    info: {
      title: "Shuntbook API",
      version: API_VERSION,
      description:
        "Read-only JSON access to Shuntbook's catalogue of FPV boards and the community's voltage scale, current scale and current offset values. Free to use without a key. Every success carries an ETag and Cache-Control; errors share one body (Error) and are never cached.",
    },
    servers: [{ url: "/api/v1", description: "This site" }],
  });
}

let cached: { document: OpenAPIObject; text: string; etag: string } | undefined;

/** The document, generated once per process (it depends only on code). */
export function openApiDocument(): { document: OpenAPIObject; text: string; etag: string } {
  if (!cached) {
    const document = buildDocument();
    const text = JSON.stringify(document);
    cached = { document, text, etag: etagOf(text) };
  }
  return cached;
}
