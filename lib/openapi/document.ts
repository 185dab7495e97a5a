import { OpenAPIRegistry, OpenApiGeneratorV3 } from "@asteasolutions/zod-to-openapi";
import type { OpenAPIObject } from "openapi3-ts/oas30";
import { z } from "zod";
import { CatalogueParamsSchema, DEFAULT_PAGE_SIZE, MAX_PAGE, MAX_PAGE_SIZE, QUERY_MAX_LENGTH } from "@/lib/catalogue/search-params";
import { IDEMPOTENCY_HEADER, KEY_TTL_HOURS } from "@/lib/submissions/idempotency";
import { submissionSchema } from "@/lib/submissions/schema";
import { VersionSchema } from "@/lib/submissions/update";
import { etagOf } from "@/lib/http/etag";
import { BoardDetailResponseSchema, BoardListResponseSchema } from "@/lib/catalogue/api-schemas";
import { ErrorBodySchema } from "@/lib/http/error-body";
import { SubmissionListResponseSchema, SubmissionResponseSchema } from "@/lib/submissions/api-schemas";
import { OwnListQuerySchema } from "@/lib/submissions/own-list";
import { BoardValuesResponseSchema, ValuesQuerySchema } from "@/lib/published/api-schemas";

// The OpenAPI 3 document of /api/v1, generated from the same zod schemas that parse the requests
// (lib/catalogue/search-params.ts, lib/published/api-schemas.ts, lib/submissions/schema.ts) and type
// the responses (each concept's api-schemas.ts). Served at /api/v1/openapi.json and rendered at /api-docs.
// The contribution endpoints are here too; the moderation, admin and garage ones serve the site's
// own pages and are left out until someone outside needs them.

const API_VERSION = "1.0.0";

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
    Object.entries(CatalogueParamsSchema.shape).map(([name, field]) => [
      name,
      field.meta({ description: CATALOGUE_PARAM_DOCS[name as keyof typeof CATALOGUE_PARAM_DOCS] }),
    ]),
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
const unavailable = { 500: error("Unexpected server error (logged)."), 503: error("The database is unreachable; try again.") };
const signedIn = {
  401: error("Not signed in: send the session cookie the site sets at sign-in."),
};
const submissionIdParam = z.object({
  id: z
    .string()
    .regex(/^[1-9][0-9]*$/)
    .meta({ description: "The submission's id.", example: "42" }),
});
const privateHeaders = z.object({ "Cache-Control": z.string().meta({ example: "private, no-store" }) });
const submissionBody = submissionSchema().meta({
  id: "SubmissionInput",
  description:
    "A contribution: the board revision and family (by id, as in the values response), the values in steps of the family's unit, how they were measured, and the evidence that method needs. The same schema checks the site's form.",
});

const notModified = { description: "Not modified: the ETag sent in If-None-Match is still current. No body.", headers: readHeaders };

function buildDocument(): OpenAPIObject {
  const registry = new OpenAPIRegistry();

  registry.registerPath({
    method: "get",
    path: "/boards",
    operationId: "listBoards",
    summary: "Search and list boards",
    description:
      "The catalogue, one page at a time. The same parameters as the /boards page; unknown parameters are ignored, and an empty value counts as absent.",
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

  registry.registerComponent("securitySchemes", "session", {
    type: "apiKey",
    in: "cookie",
    name: "next-auth.session-token",
    description: "The session cookie set by signing in on the site (named __Secure-next-auth.session-token over HTTPS).",
  });
  const session = [{ session: [] }];

  registry.registerPath({
    method: "post",
    path: "/submissions",
    operationId: "createSubmission",
    summary: "Send a contribution with its evidence",
    description: `Stored as pending for moderation (or approved at once for a trusted contributor when nothing is flagged). The server recomputes what the evidence implies and flags a mismatch. Send an ${IDEMPOTENCY_HEADER} (for example a UUID) so that a retry never makes a second submission: the same key with the same body within ${KEY_TTL_HOURS} hours answers the first response again, marked Idempotent-Replayed.`,
    security: session,
    request: {
      headers: z.object({ [IDEMPOTENCY_HEADER]: z.string().optional().meta({ description: "1 to 255 visible ASCII characters; per person." }) }),
      body: { required: true, content: json(submissionBody) },
    },
    responses: {
      201: {
        description: "Stored. Location names the new submission.",
        headers: privateHeaders.extend({
          Location: z.string(),
          "Idempotent-Replayed": z.string().optional().meta({ description: "true when this is the stored answer to an earlier request with the same key." }),
        }),
        content: json(SubmissionResponseSchema),
      },
      400: error("The body is refused: fieldErrors is keyed by each field's dotted path, like cycles.2.chargedMah. Nothing is stored."),
      ...signedIn,
      422: error(`The ${IDEMPOTENCY_HEADER} was used before with a different body.`),
      ...unavailable,
    },
  });

  registry.registerPath({
    method: "get",
    path: "/submissions",
    operationId: "listOwnSubmissions",
    summary: "The caller's own submissions, newest first, a page at a time",
    security: session,
    request: { query: OwnListQuerySchema },
    responses: {
      200: { description: "The caller's submissions.", headers: privateHeaders, content: json(SubmissionListResponseSchema) },
      400: error("A query parameter is not one the list takes; fieldErrors names it."),
      ...signedIn,
      ...unavailable,
    },
  });

  registry.registerPath({
    method: "get",
    path: "/submissions/{id}",
    operationId: "getOwnSubmission",
    summary: "One of the caller's own submissions",
    security: session,
    request: { params: submissionIdParam },
    responses: {
      200: { description: "The submission, with the moderator's note once there is one.", headers: privateHeaders, content: json(SubmissionResponseSchema) },
      ...signedIn,
      404: error("No submission of the caller's has this id."),
      ...unavailable,
    },
  });

  registry.registerPath({
    method: "patch",
    path: "/submissions/{id}",
    operationId: "editOwnSubmission",
    summary: "Edit a submission that waits for moderation",
    description:
      "The whole submission again, plus the version it was edited from. Allowed while it is pending or sent back for changes; an edit of a submission sent back for changes returns it to the queue.",
    security: session,
    request: { params: submissionIdParam, body: { required: true, content: json(z.intersection(VersionSchema, submissionBody)) } },
    responses: {
      200: { description: "The edited submission.", headers: privateHeaders, content: json(SubmissionResponseSchema) },
      400: error("The body is refused; fieldErrors names each field. Nothing is changed."),
      ...signedIn,
      403: error("Only its contributor may edit a submission."),
      404: error("No submission has this id."),
      409: error("Someone acted on it first: the version is stale, or it was already decided."),
      ...unavailable,
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
        "JSON access to Shuntbook's catalogue of FPV boards and the community's voltage scale, current scale and current offset values, free to read without a key (every read carries an ETag and Cache-Control), and the contribution endpoints for signed-in people (answers about one person are private, never cached). Errors share one body (Error) and are never cached.",
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
