// The route kernel, for route files: one import line.
export { ApiError, badRequest, notFound } from "./errors";
export { parseBody } from "./parse-body";
export { idParams, pathId } from "./path-id";
export { jsonOk, jsonWithEtag, noContent, privateJson, tooManyRequests } from "./respond";
export { route, routes, type RouteInput, type RouteSpec } from "./route";
