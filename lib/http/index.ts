// The route kernel, for route files: one import line.
export { ApiError, notFound } from "./errors";
export { parseBody } from "./parse-body";
export { idParams } from "./path-id";
export { jsonOk, jsonWithEtag, noContent, privateJson, tooManyRequests } from "./respond";
export { route, routes } from "./route";
