import { z } from "zod";
import { route, routes } from "@/lib/http";
import { boardValuesResponse } from "@/lib/published/api-response";
import { ValuesQuerySchema } from "@/lib/published/api-schemas";

// GET /api/v1/boards/{slug}/values: published values per revision and firmware family, cached in
// memory and tagged so that a revalidation costs no database work (lib/published/api-response.ts).
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "public", params: z.object({ slug: z.string() }), query: ValuesQuerySchema }, async ({ req, params, query }) =>
    boardValuesResponse(req, params.slug, query),
  ),
});
