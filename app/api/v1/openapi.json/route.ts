import { jsonWithEtag, route, routes } from "@/lib/http";
import { openApiDocument } from "@/lib/openapi/document";

// GET /api/v1/openapi.json: the OpenAPI 3 document, generated from the zod schemas once per process.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "public" }, async ({ req }) => {
    const { text, etag } = openApiDocument();
    return jsonWithEtag(req, etag, text);
  }),
});
