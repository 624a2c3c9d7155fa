/**
 * HTTP load with the CPU it cost: how much the server process and all of
 * PostgreSQL spent per response, and how many cores other programs kept busy
 * meanwhile. On a shared machine latency moves with other load; CPU per
 * response much less, so the two together say what a figure is worth.
 */
import { performance } from 'node:perf_hooks';
import { measureHttp, type HttpFigures } from './http.ts';
import { machineBusySeconds, processCpuSeconds, treeCpuSeconds } from './processes.ts';

export interface AccountedLoad {
  http: HttpFigures;
  serverCpuMs: number;
  postgresCpuMs: number;
  /** This process (autocannon). */
  loadGeneratorCpuMs: number;
  otherCores: number;
}

export interface AccountedLoadOptions {
  connections: number;
  durationSeconds: number;
  warmupSeconds: number;
  headers: Record<string, string>;
  serverPid: number;
  postmasterPid: number;
}

/** Warms up first, then reads the CPU counters around the measured part only. */
export async function measureAccounted(url: string, options: AccountedLoadOptions): Promise<AccountedLoad> {
  const load = { connections: options.connections, headers: options.headers, warmupSeconds: 0 };
  if (options.warmupSeconds > 0) await measureHttp(url, { ...load, durationSeconds: options.warmupSeconds });
  const snapshot = () => ({
    at: performance.now(),
    machine: machineBusySeconds(),
    server: processCpuSeconds(options.serverPid),
    postgres: treeCpuSeconds(options.postmasterPid),
    self: process.cpuUsage(),
  });
  const before = snapshot();
  const http = await measureHttp(url, { ...load, durationSeconds: options.durationSeconds });
  const after = snapshot();
  const selfUsage = process.cpuUsage(before.self);
  const server = after.server - before.server;
  const postgres = after.postgres - before.postgres;
  const self = (selfUsage.user + selfUsage.system) / 1e6;
  const others = after.machine - before.machine - server - postgres - self;
  const perResponse = (seconds: number) => (http.responses === 0 ? Number.NaN : (seconds * 1000) / http.responses);
  return {
    http,
    serverCpuMs: perResponse(server),
    postgresCpuMs: perResponse(postgres),
    loadGeneratorCpuMs: perResponse(self),
    otherCores: Math.max(0, others) / ((after.at - before.at) / 1000),
  };
}
