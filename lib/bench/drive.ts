import autocannon from "autocannon";
import type { LoadResult } from "./figures";

// One target under load with autocannon: an unrecorded warm-up, then the measured run. Every
// request goes through setupRequest, for every target alike (so the load generator does the same
// work per request whatever it drives), and asks for whatever `pick` returns: for the lookups a
// board drawn uniformly at random from the whole data set, fresh for each request.

export type Pick = () => { path: string; headers?: Record<string, string> };

export type LoadShape = { connections: number; duration: number; warmup: number };

function once(url: string, pick: Pick, connections: number, duration: number): Promise<autocannon.Result> {
  const instance = autocannon({
    url,
    connections,
    duration,
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
  return Promise.resolve(instance);
}

export async function drive(url: string, pick: Pick, shape: LoadShape): Promise<LoadResult> {
  if (shape.warmup > 0) await once(url, pick, shape.connections, shape.warmup);
  return once(url, pick, shape.connections, shape.duration);
}

/** A uniform draw from `items` per call. */
export function uniformPicker<T>(items: readonly T[], random: () => number = Math.random): () => T {
  if (items.length === 0) throw new Error("nothing to pick from");
  return () => items[Math.min(items.length - 1, Math.floor(random() * items.length))];
}
