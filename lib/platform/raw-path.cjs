// Loaded into the app's server process beside peer-address.cjs (NODE_OPTIONS=--require, see
// serverEnv in next-build.ts). Next.js parses each request target with the WHATWG URL parser,
// which resolves "%2e%2e" as ".." (WHATWG URL Standard, "double-dot URL path segment") and fails on
// a malformed escape like "%ZZ": so /api/v1/%2e%2e/%2e%2e/admin reached the admin page's sign-in
// redirect instead of the API's JSON 404, and /boards/%ZZ answered a bare "Internal Server Error".
// The raw target is only visible here, before Next.js sees the request: a path that is malformed
// or climbs with encoded dots is re-pointed at an address that names nothing, so the API answers
// its JSON 404 and a page address the site's not-found page. Node publishes
// "http.server.request.start" before the server's "request" event (Node's diagnostics_channel
// documentation, "HTTP" built-in channels).
// eslint-disable-next-line @typescript-eslint/no-require-imports -- a --require preload is CommonJS: import is not available here
const channel = require("node:diagnostics_channel");

// a path segment of only dots, at least one of them percent-encoded ("%2e", ".%2E", "%2e.")
const ENCODED_DOT_SEGMENT = /(^|\/)(\.|%2e)*%2e(\.|%2e)*(\/|$)/i;

function malformed(path) {
  try {
    decodeURIComponent(path);
    return false;
  } catch {
    return true;
  }
}

/** Where a raw request target is re-pointed, or null when Next.js may read it as it is. */
function refusedPathTarget(target) {
  const path = String(target ?? "").split("?")[0];
  if (!malformed(path) && !ENCODED_DOT_SEGMENT.test(path)) return null;
  return /^\/api(\/|$)/i.test(path) ? "/api/v1/unreadable-address" : "/unreadable-address";
}

channel.subscribe("http.server.request.start", ({ request }) => {
  const target = refusedPathTarget(request.url);
  if (target) request.url = target;
});

module.exports = { refusedPathTarget };
