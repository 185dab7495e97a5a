// Loaded into the app's server process by the launcher (NODE_OPTIONS=--require, so `next dev`'s
// forked server gets it too). Appends the socket's address to X-Forwarded-For on every incoming
// request, as a reverse proxy does, before Next.js sees the request: the right-most entry is then
// always the peer's, whatever the client sent (see lib/auth/client-address.ts). Node publishes
// "http.server.request.start" before the server's "request" event (Node's diagnostics_channel
// documentation, "HTTP" built-in channels), so no server code is patched.
// eslint-disable-next-line @typescript-eslint/no-require-imports -- a --require preload is CommonJS: import is not available here
const channel = require("node:diagnostics_channel");

channel.subscribe("http.server.request.start", ({ request, socket }) => {
  const peer = socket?.remoteAddress;
  if (!peer) return;
  const prior = request.headers["x-forwarded-for"];
  request.headers["x-forwarded-for"] = prior ? `${prior}, ${peer}` : peer;
});
