import { jsonOk, route, routes } from "@/lib/http";
import { boardList, catalogueQuery } from "@/lib/catalogue/api-response";
import type { BoardListResponse } from "@/lib/catalogue/api-schemas";

// GET /api/v1/boards: the catalogue, through the same parameter schema as the /boards page.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "public", query: catalogueQuery }, async ({ req, query }) => jsonOk<BoardListResponse>(req, await boardList(query))),
});
