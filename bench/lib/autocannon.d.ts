// autocannon 9 ships no type declarations; this covers the part bench/lib/http.ts uses.
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  namespace autocannon {
    interface Options {
      url: string;
      connections?: number;
      duration?: number;
      method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
      headers?: Record<string, string>;
      body?: string;
      warmup?: { connections?: number; duration?: number };
    }
    interface Histogram {
      average: number;
      mean: number;
      stddev: number;
      min: number;
      max: number;
      p50: number;
      p90: number;
      p99: number;
      total: number;
    }
    interface Result {
      duration: number;
      errors: number;
      timeouts: number;
      non2xx: number;
      latency: Histogram;
      requests: Histogram & { sent: number };
      throughput: Histogram;
    }
    interface Instance extends EventEmitter, PromiseLike<Result> {
      on(event: 'response', listener: (client: unknown, statusCode: number, bytes: number, responseTimeMs: number) => void): this;
      on(event: string, listener: (...args: unknown[]) => void): this;
    }
  }

  function autocannon(options: autocannon.Options): autocannon.Instance;
  export = autocannon;
}
