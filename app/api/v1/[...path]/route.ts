import { ApiError, route, routes } from "@/lib/http";

// Any /api/v1 address that names no endpoint: the API's JSON 404 instead of the site's HTML page.
const unknownEndpoint = route({ auth: "public" }, async ({ req }) => {
  throw new ApiError(404, `There is no endpoint at ${new URL(req.url).pathname}. The endpoints are listed at /api/v1/openapi.json.`);
});

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: unknownEndpoint,
  POST: unknownEndpoint,
  PUT: unknownEndpoint,
  PATCH: unknownEndpoint,
  DELETE: unknownEndpoint,
});
