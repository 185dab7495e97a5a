import { readFileSync } from "node:fs";
import { createServer, type Server } from "node:http";

// Target (d) of the lookup benchmark, the machine's ceiling: plain node:http answering each
// values path with the bytes and headers the app sent for it, from memory. No framework, no
// routing beyond one Map lookup, no JSON work. Run as its own process (like the app), so that it
// does not share an event loop with the load generator:
//   node --require tsx/cjs tests/benchmarks/bare-server.ts <responses.json> <port>

/** What the app answered for one path; `headers` are the ones that shape the bytes on the wire. */
export type StoredResponse = { headers: Record<string, string>; body: string };

const NOT_FOUND = Buffer.from(JSON.stringify({ error: { status: 404, message: "not in the recorded responses" } }));

export function startBareServer(responses: Record<string, StoredResponse>, port: number, host = "127.0.0.1"): Promise<Server> {
  // encoded once: the bare server does no per-request work beyond writing bytes
  const byPath = new Map(
    Object.entries(responses).map(([path, r]) => {
      const body = Buffer.from(r.body);
      return [path, { body, headers: { ...r.headers, "Content-Length": String(body.length) } }];
    }),
  );
  const server = createServer((request, response) => {
    const hit = byPath.get(request.url ?? "");
    if (!hit) {
      response.writeHead(404, { "Content-Type": "application/json; charset=utf-8", "Content-Length": String(NOT_FOUND.length) });
      response.end(NOT_FOUND);
      return;
    }
    response.writeHead(200, hit.headers);
    response.end(hit.body);
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => resolve(server));
  });
}

if (require.main === module) {
  const [file, port] = process.argv.slice(2);
  if (!file || !port) {
    console.error("usage: bare-server.ts <responses.json> <port>");
    process.exit(2);
  }
  const responses = JSON.parse(readFileSync(file, "utf8")) as Record<string, StoredResponse>;
  void startBareServer(responses, Number(port)).then(() => {
    for (const signal of ["SIGTERM", "SIGINT"] as const) process.on(signal, () => process.exit(0));
  });
}
