import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startBareServer } from "@/tests/benchmarks/bare-server";

// Target (d) must send the bytes and headers the app sent, or it is not the same response.
describe("bare node:http ceiling", () => {
  const body = JSON.stringify({ board: { slug: "benchmark-board-00001" }, revisions: [] });
  const headers = { "content-type": "application/json; charset=utf-8", etag: '"abc"', "cache-control": "public, max-age=60" };
  let server: Awaited<ReturnType<typeof startBareServer>>;
  let base: string;

  beforeAll(async () => {
    server = await startBareServer({ "/api/v1/boards/benchmark-board-00001/values": { headers, body } }, 0);
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

  it("answers a recorded path with its body and headers", async () => {
    const response = await fetch(`${base}/api/v1/boards/benchmark-board-00001/values`);
    expect(response.status).toBe(200);
    expect(await response.text()).toBe(body);
    expect(response.headers.get("etag")).toBe('"abc"');
    expect(response.headers.get("content-length")).toBe(String(Buffer.byteLength(body)));
  });

  it("answers anything else with 404", async () => {
    expect((await fetch(`${base}/api/v1/boards/nope/values`)).status).toBe(404);
  });
});
