import { badRequest } from "@/lib/api/errors";
import { apiRoute, readOnly } from "@/lib/api/handler";
import { boardListResponse } from "@/lib/api/boards-response";
import { queryRecord } from "@/lib/api/query";
import { jsonOk } from "@/lib/api/respond";
import type { BoardListResponse } from "@/lib/api/schemas/boards";
import { listBoards } from "@/lib/catalogue/list-boards";
import { parseCatalogueParams } from "@/lib/catalogue/search-params";

// GET /api/v1/boards: the catalogue, through the same parameter schema as the /boards page.
export const GET = apiRoute(async (request) => {
  const parsed = parseCatalogueParams(queryRecord(request));
  if (!parsed.ok) throw badRequest(parsed.fieldErrors);
  const page = await listBoards(parsed.params);
  return jsonOk<BoardListResponse>(request, boardListResponse(page, parsed.params));
});

export const POST = readOnly();
export const PUT = readOnly();
export const PATCH = readOnly();
export const DELETE = readOnly();
