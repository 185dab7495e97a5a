import autocannon from "autocannon";
import type { Samples } from "./figures";

// One target under load with autocannon, collecting raw samples (responses completed in each
// whole second of the run, and every response's latency) so that runs split into interleaved
// rounds can be pooled (figures.ts). Every request goes through setupRequest, for every target
// alike, so the load generator does the same work per request whatever it drives; it asks for
// whatever `pick` returns: for the lookups a board drawn uniformly at random from the whole data
// set, fresh for each request.

export type Pick = () => { path: string; headers?: Record<string, string> };

export async function sample(url: string, pick: Pick, connections: number, seconds: number): Promise<Samples> {
  const perSecond: number[] = [];
  const latenciesMs: number[] = [];
  let startedAt = performance.now();
  const instance = autocannon({
    url,
    connections,
    duration: seconds,
    pipelining: 1,
    timeout: 10,
    requests: [
      {
        setupRequest: (request) => {
          const { path, headers } = pick();
          return { ...request, path, headers: headers ? { ...request.headers, ...headers } : request.headers };
        },
      },
    ],
  });
  instance.on("start", () => (startedAt = performance.now()));
  instance.on("response", (_client, _status, _bytes, responseTime) => {
    latenciesMs.push(responseTime);
    const second = Math.floor((performance.now() - startedAt) / 1000);
    while (perSecond.length <= second) perSecond.push(0);
    perSecond[second]++;
  });
  const result = await instance;
  // the last second is cut short by the end of the run; it would drag the median down
  if (perSecond.length > seconds) perSecond.length = seconds;
  const statusCounts = Object.fromEntries(Object.entries(result.statusCodeStats).map(([code, s]) => [code, Number(s.count)]));
  return { perSecond, latenciesMs, statusCounts, errors: result.errors };
}

/** Load without recording: brings the JIT, the caches and the connection pools to their steady state. */
export async function warmUp(url: string, pick: Pick, connections: number, seconds: number): Promise<void> {
  if (seconds > 0) await sample(url, pick, connections, seconds);
}

/** A uniform draw from `items` per call. */
export function uniformPicker<T>(items: readonly T[], random: () => number = Math.random): () => T {
  if (items.length === 0) throw new Error("nothing to pick from");
  return () => items[Math.min(items.length - 1, Math.floor(random() * items.length))];
}
