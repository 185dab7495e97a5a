import { badRequest } from "@/lib/api/errors";
import { apiRoute, readOnly } from "@/lib/api/handler";
import { parseQuery, queryRecord } from "@/lib/api/query";
import { ValuesQuerySchema } from "@/lib/api/schemas/values";
import { boardValuesResponse } from "@/lib/api/values-response";

type Context = { params: Promise<{ slug: string }> };

// GET /api/v1/boards/{slug}/values: published values per revision and firmware family, cached in
// memory and tagged so that a revalidation costs no database work (lib/api/values-response.ts).
export const GET = apiRoute<Context>(async (request, { params }) => {
  const parsed = parseQuery(ValuesQuerySchema, queryRecord(request));
  if (!parsed.ok) throw badRequest(parsed.fieldErrors);
  return boardValuesResponse(request, (await params).slug, parsed.params);
});

export const POST = readOnly();
export const PUT = readOnly();
export const PATCH = readOnly();
export const DELETE = readOnly();
