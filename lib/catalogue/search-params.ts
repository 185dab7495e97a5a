import { z } from "zod";
import { BOARD_KINDS } from "@/lib/vocabulary";

// The one definition of the catalogue's query parameters. The /boards page and the JSON API
// (GET /api/v1/boards) both parse through parseCatalogueParams, so a link that works in one
// works in the other and both reject the same bad input with the same words.

export const CATALOGUE_SORTS = ["relevance", "name", "newest", "values"] as const;
export type CatalogueSort = (typeof CATALOGUE_SORTS)[number];

export const SORT_LABELS: Record<CatalogueSort, string> = {
  relevance: "Best match",
  name: "Name A–Z",
  newest: "Newest revision",
  values: "Most approved values",
};

export const QUERY_MAX_LENGTH = 100;
export const DEFAULT_PAGE_SIZE = 20;
export const MAX_PAGE_SIZE = 100;
// Far beyond any real catalogue; it keeps OFFSET (and so the query cost) bounded.
export const MAX_PAGE = 10_000;

// Same rule as the CHECK on board_models.mounting_pattern: hole spacing in mm, "20x20", "30.5x30.5".
const MOUNTING_PATTERN_RE = /^[0-9]{1,2}(\.[0-9])?x[0-9]{1,2}(\.[0-9])?$/;

const positiveInt = (field: string, max: number) =>
  z
    .string()
    .regex(/^[0-9]+$/, `${field} must be a whole number, 1 or more`)
    .transform(Number)
    .pipe(z.number().int().min(1, `${field} must be 1 or more`).max(max, `${field} must be at most ${max}`));

export const CatalogueParamsSchema = z.object({
  q: z.string().trim().max(QUERY_MAX_LENGTH, `q (the search text) must be at most ${QUERY_MAX_LENGTH} characters`).optional(),
  kind: z.enum(BOARD_KINDS, { error: `kind must be one of: ${BOARD_KINDS.join(", ")}` }).optional(),
  mounting: z.string().trim().toLowerCase().regex(MOUNTING_PATTERN_RE, "mounting must be hole spacing in millimetres, like 20x20 or 30.5x30.5").optional(),
  sort: z.enum(CATALOGUE_SORTS, { error: `sort must be one of: ${CATALOGUE_SORTS.join(", ")}` }).optional(),
  page: positiveInt("page", MAX_PAGE).optional(),
  pageSize: positiveInt("pageSize", MAX_PAGE_SIZE).optional(),
});

export type CatalogueParams = {
  /** Trimmed search text; undefined when there is none. */
  q?: string;
  kind?: (typeof BOARD_KINDS)[number];
  mounting?: string;
  /** Always set: relevance when there is search text, otherwise name (relevance needs a query). */
  sort: CatalogueSort;
  page: number;
  pageSize: number;
};

export type CatalogueParamsResult = { ok: true; params: CatalogueParams } | { ok: false; fieldErrors: Record<string, string[]> };

const KNOWN_FIELDS = Object.keys(CatalogueParamsSchema.shape) as (keyof typeof CatalogueParamsSchema.shape)[];

/**
 * Parses raw query parameters (Next's searchParams, or Object.fromEntries of a URLSearchParams).
 * An empty value counts as absent, because a GET form sends every field, filled in or not.
 * Parameters the catalogue does not know are ignored, so tracking tags do not break links.
 */
export function parseCatalogueParams(input: Record<string, string | string[] | undefined>): CatalogueParamsResult {
  const fieldErrors: Record<string, string[]> = {};
  const raw: Record<string, string> = {};
  for (const field of KNOWN_FIELDS) {
    const value = input[field];
    if (Array.isArray(value)) {
      const filled = value.filter((v) => v.trim() !== "");
      if (filled.length > 1) {
        fieldErrors[field] = [`${field} was given ${filled.length} times; give it once`];
        continue;
      }
      if (filled.length === 1) raw[field] = filled[0];
    } else if (value !== undefined && value.trim() !== "") {
      raw[field] = value;
    }
  }

  const parsed = CatalogueParamsSchema.safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = String(issue.path[0] ?? "query");
      (fieldErrors[field] ??= []).push(issue.message);
    }
  }
  if (!parsed.success || Object.keys(fieldErrors).length > 0) return { ok: false, fieldErrors };

  const { q, kind, mounting, sort, page, pageSize } = parsed.data;
  const query = q === "" ? undefined : q;
  const defaultSort: CatalogueSort = query ? "relevance" : "name";
  return {
    ok: true,
    params: {
      q: query,
      kind,
      mounting,
      // "relevance" without search text has nothing to rank by, so it falls back to name order
      sort: sort === undefined || (sort === "relevance" && !query) ? defaultSort : sort,
      page: page ?? 1,
      pageSize: pageSize ?? DEFAULT_PAGE_SIZE,
    },
  };
}

/**
 * The query string for a catalogue state, leaving out defaults so that URLs stay short and
 * shareable. Used by the page's links (pagination, sort, kind chips) and the API's next/prev links.
 */
export function catalogueQueryString(params: Partial<CatalogueParams>): string {
  const search = new URLSearchParams();
  if (params.q) search.set("q", params.q);
  if (params.kind) search.set("kind", params.kind);
  if (params.mounting) search.set("mounting", params.mounting);
  const defaultSort = params.q ? "relevance" : "name";
  if (params.sort && params.sort !== defaultSort) search.set("sort", params.sort);
  if (params.page && params.page > 1) search.set("page", String(params.page));
  if (params.pageSize && params.pageSize !== DEFAULT_PAGE_SIZE) search.set("pageSize", String(params.pageSize));
  const s = search.toString();
  return s ? `?${s}` : "";
}
