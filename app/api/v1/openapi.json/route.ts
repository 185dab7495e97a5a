import { apiRoute, readOnly } from "@/lib/api/handler";
import { openApiDocument } from "@/lib/api/openapi";
import { jsonWithEtag } from "@/lib/api/respond";

// GET /api/v1/openapi.json: the OpenAPI 3 document, generated from the zod schemas once per process.
export const GET = apiRoute(async (request) => {
  const { text, etag } = openApiDocument();
  return jsonWithEtag(request, etag, text);
});

export const POST = readOnly();
export const PUT = readOnly();
export const PATCH = readOnly();
export const DELETE = readOnly();
