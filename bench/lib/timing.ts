import { performance } from 'node:perf_hooks';

export interface CallFigures {
  callsPerSecond: number;
  /** Per-call time, from the median and the 95th-percentile batch. */
  p50Us: number;
  p95Us: number;
  calls: number;
}

/**
 * Times a synchronous function. Calls run in batches long enough (about a
 * millisecond) for the clock to resolve them; per-call figures are batch time
 * divided by batch size. `fn` gets the call's index within its batch, so a
 * benchmark can vary its input and the optimiser cannot hoist the work out of the loop.
 */
/** Each call's result lands here, where the optimiser must assume someone reads it. */
export const sink: { value: unknown } = { value: undefined };

export function timeCalls(fn: (call: number) => unknown, options: { durationMs?: number; warmupMs?: number } = {}): CallFigures {
  const durationMs = options.durationMs ?? 1_500;
  const warmupMs = options.warmupMs ?? 300;
  let batchSize = 1;
  const warmupEnd = performance.now() + warmupMs;
  while (performance.now() < warmupEnd) {
    const started = performance.now();
    for (let i = 0; i < batchSize; i += 1) sink.value = fn(i);
    if (performance.now() - started < 1) batchSize *= 2;
  }

  const perCallUs: number[] = [];
  let calls = 0;
  const started = performance.now();
  while (performance.now() - started < durationMs) {
    const batchStarted = performance.now();
    for (let i = 0; i < batchSize; i += 1) sink.value = fn(i);
    perCallUs.push(((performance.now() - batchStarted) * 1000) / batchSize);
    calls += batchSize;
  }
  const elapsedMs = performance.now() - started;

  perCallUs.sort((a, b) => a - b);
  const at = (fraction: number) => perCallUs[Math.min(perCallUs.length - 1, Math.ceil(fraction * perCallUs.length) - 1)]!;
  return { callsPerSecond: (calls / elapsedMs) * 1000, p50Us: at(0.5), p95Us: at(0.95), calls };
}
