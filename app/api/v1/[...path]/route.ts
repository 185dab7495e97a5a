import { ApiError } from "@/lib/api/errors";
import { apiRoute } from "@/lib/api/handler";

// Any /api/v1 address that names no endpoint: the API's JSON 404 instead of the site's HTML page.
const unknownEndpoint = apiRoute(async (request) => {
  throw new ApiError(404, `There is no endpoint at ${new URL(request.url).pathname}. The endpoints are listed at /api/v1/openapi.json.`);
});

export const GET = unknownEndpoint;
export const POST = unknownEndpoint;
export const PUT = unknownEndpoint;
export const PATCH = unknownEndpoint;
export const DELETE = unknownEndpoint;
