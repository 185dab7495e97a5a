// The part of autocannon 9's API the lookup benchmark uses (the package ships no types, and the
// benchmark is the only user). See node_modules/autocannon/README.md, "API" and "Results".
declare module "autocannon" {
  namespace autocannon {
    type RawRequest = { method?: string; path?: string; headers?: Record<string, string>; body?: string };
    type RequestStep = RawRequest & { setupRequest?: (request: RawRequest, context: Record<string, unknown>) => RawRequest | null };
    type Options = {
      url: string;
      connections?: number;
      /** seconds */
      duration?: number;
      pipelining?: number;
      /** seconds to wait for a response */
      timeout?: number;
      headers?: Record<string, string>;
      requests?: RequestStep[];
      excludeErrorStats?: boolean;
    };
    type Histogram = {
      average: number;
      mean: number;
      stddev: number;
      min: number;
      max: number;
      total: number;
      p50: number;
      p90: number;
      p99: number;
    };
    type Result = {
      requests: Histogram;
      latency: Histogram;
      throughput: Histogram;
      /** seconds */
      duration: number;
      errors: number;
      timeouts: number;
      non2xx: number;
      statusCodeStats: Record<string, { count: number }>;
    };
    type Instance = PromiseLike<Result> & {
      stop(): void;
      on(event: "start", listener: () => void): Instance;
      /** every response; responseTime in ms */
      on(event: "response", listener: (client: unknown, statusCode: number, resBytes: number, responseTime: number) => void): Instance;
    };
  }
  function autocannon(options: autocannon.Options): autocannon.Instance;
  export = autocannon;
}
