import { z } from "zod";
import { jsonOk, route, routes } from "@/lib/http";
import { boardDetail } from "@/lib/catalogue/api-response";
import type { BoardDetailResponse } from "@/lib/catalogue/api-schemas";

// GET /api/v1/boards/{slug}: one board with its revisions' sensor hardware.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "public", params: z.object({ slug: z.string() }) }, async ({ req, params }) =>
    jsonOk<BoardDetailResponse>(req, await boardDetail(params.slug)),
  ),
});
