// The part of autocannon's programmatic API the load benchmark uses (the package ships no types).
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  interface Histogram {
    average: number;
    max: number;
    p50: number;
    p90: number;
    p97_5: number;
    p99: number;
  }

  interface Result {
    requests: Histogram & { total: number };
    latency: Histogram;
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    statusCodeStats: Record<string, { count: number }>;
  }

  interface Options {
    url: string | string[];
    connections?: number;
    duration?: number;
    headers?: Record<string, string>;
    timeout?: number;
  }

  interface Instance extends EventEmitter, PromiseLike<Result> {
    stop(): void;
  }

  function autocannon(options: Options): Instance;
  export default autocannon;
}
