import autocannon from 'autocannon';

export interface HttpLoad {
  connections: number;
  durationSeconds: number;
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  headers?: Record<string, string>;
  body?: string;
  /** Seconds of load before measuring, so the JIT and connection pools settle; default 1. */
  warmupSeconds?: number;
}

export interface HttpFigures {
  requestsPerSecond: number;
  latencyP50Ms: number;
  latencyP95Ms: number;
  latencyP99Ms: number;
  responses: number;
  /** Connection errors and timeouts. */
  errors: number;
  /** Responses outside 2xx: a benchmark that measured error pages measured the wrong thing. */
  non2xx: number;
}

function percentile(sorted: Float64Array, fraction: number): number {
  if (sorted.length === 0) return Number.NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil(fraction * sorted.length) - 1)]!;
}

/**
 * Puts `url` under load with autocannon and reports throughput and latency.
 * Latency percentiles come from every response's own time, because
 * autocannon's summary has no 95th percentile.
 */
export async function measureHttp(url: string, load: HttpLoad): Promise<HttpFigures> {
  const times: number[] = [];
  const instance = autocannon({
    url,
    connections: load.connections,
    duration: load.durationSeconds,
    method: load.method ?? 'GET',
    ...(load.headers === undefined ? {} : { headers: load.headers }),
    ...(load.body === undefined ? {} : { body: load.body }),
    ...(load.warmupSeconds === 0 ? {} : { warmup: { connections: load.connections, duration: load.warmupSeconds ?? 1 } }),
  });
  instance.on('response', (_client, _status, _bytes, responseTimeMs) => {
    times.push(responseTimeMs);
  });
  const result = await instance;
  const sorted = Float64Array.from(times).sort();
  return {
    requestsPerSecond: result.requests.total / result.duration,
    latencyP50Ms: percentile(sorted, 0.5),
    latencyP95Ms: percentile(sorted, 0.95),
    latencyP99Ms: percentile(sorted, 0.99),
    responses: sorted.length,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
  };
}
