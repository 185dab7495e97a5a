import { badRequest, notFound } from "@/lib/http/errors";
import { boardFacts, revisionDetail } from "./board-facts";
import { getBoardBySlug, type BoardDetail } from "./get-board";
import { listBoards, type CataloguePage, type CatalogueRow } from "./list-boards";
import { catalogueQueryString, parseCatalogueParams, type CatalogueParams } from "./search-params";
import type { BoardDetailResponse, BoardListResponse } from "./api-schemas";

// lib/catalogue's results in the API's published shape. Mapped field by field (not spread) so a
// column added to a query does not silently become part of the public API.

const API_BASE = "/api/v1";

function boardLinks(slug: string) {
  const self = `${API_BASE}/boards/${encodeURIComponent(slug)}`;
  return { self, values: `${self}/values`, page: `/boards/${encodeURIComponent(slug)}` };
}

function summary(row: CatalogueRow): BoardListResponse["boards"][number] {
  return {
    ...boardFacts(row),
    manufacturer: { slug: row.manufacturerSlug, name: row.manufacturerName },
    revisionCount: row.revisionCount,
    approvedCount: row.approvedCount,
    latestReleasedOn: row.latestReleasedOn,
    score: row.score,
    links: boardLinks(row.slug),
  };
}

function boardListResponse(page: CataloguePage, params: CatalogueParams): BoardListResponse {
  const link = (p: number) => `${API_BASE}/boards${catalogueQueryString({ ...params, page: p })}`;
  return {
    boards: page.rows.map(summary),
    query: {
      q: params.q ?? null,
      kind: params.kind ?? null,
      mounting: params.mounting ?? null,
      sort: params.sort,
      page: page.page,
      pageSize: page.pageSize,
    },
    total: page.total,
    pageCount: page.pageCount,
    links: {
      self: link(page.page),
      next: page.page < page.pageCount ? link(page.page + 1) : null,
      prev: page.page > 1 ? link(Math.min(page.page - 1, page.pageCount)) : null,
    },
  };
}

function boardDetailResponse(board: BoardDetail): BoardDetailResponse {
  return {
    ...boardFacts(board),
    description: board.description,
    manufacturer: { slug: board.manufacturer.slug, name: board.manufacturer.name, website: board.manufacturer.website },
    aliases: board.aliases,
    revisions: board.revisions.map((r) => revisionDetail(r, r)),
    links: boardLinks(board.slug),
  };
}

/** GET /api/v1/boards's query, through the /boards page's parameter schema; 400 naming each bad one. */
export function catalogueQuery(record: Record<string, string | string[]>): CatalogueParams {
  const parsed = parseCatalogueParams(record);
  if (!parsed.ok) throw badRequest(parsed.fieldErrors);
  return parsed.params;
}

/** GET /api/v1/boards: one page of the catalogue. */
export async function boardList(params: CatalogueParams): Promise<BoardListResponse> {
  return boardListResponse(await listBoards(params), params);
}

/** GET /api/v1/boards/{slug}: the board, or a 404 naming `slug`. */
export async function boardDetail(slug: string): Promise<BoardDetailResponse> {
  const board = await getBoardBySlug(slug);
  if (!board) throw notFound(`No board has the slug "${slug}".`, "slug");
  return boardDetailResponse(board);
}
