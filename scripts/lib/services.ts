import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import readline from 'node:readline';
import type { Readable } from 'node:stream';
import { SetupError } from './errors.ts';
import { onShutdown } from './lifecycle.ts';
import { colour, prefixColours } from './log.ts';
import { assertPortFree } from './ports.ts';
import { REPO_ROOT } from './paths.ts';

export interface ServiceSpec {
  /** Short name: log prefix and log file name. */
  name: string;
  /** What a developer would call it, for messages ("mail catcher (maildev)"). */
  description: string;
  command: string;
  args: readonly string[];
  cwd?: string;
  env: NodeJS.ProcessEnv;
  /** Ports the service will listen on; each must be free before it starts. */
  ports: readonly { port: number; role: string }[];
  /** Polled until it answers 2xx. */
  readyUrl: string;
  readyTimeoutMs?: number;
}

export interface ServiceOptions {
  /** Every line the service prints goes to `<logDir>/<name>.log`. */
  logDir: string;
  /** Also print each line to the terminal, prefixed with the service name. */
  echo: boolean;
  /** Called when the service dies on its own after it was ready. */
  onUnexpectedExit?: (service: RunningService, exit: ServiceExit) => void;
}

export interface ServiceExit {
  code: number | null;
  signal: NodeJS.Signals | null;
}

export interface RunningService {
  name: string;
  description: string;
  pid: number;
  logFile: string;
  /** The last lines it printed, for error messages. */
  recentOutput(): string;
  exited: Promise<ServiceExit>;
  stop(): Promise<void>;
}

const STOP_GRACE_MS = 10_000;
const RECENT_LINES = 40;
let servicesStarted = 0;

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

export function describeExit(exit: ServiceExit): string {
  return exit.signal ? `was killed by ${exit.signal}` : `exited with code ${exit.code}`;
}

/**
 * Starts a long-running service in its own process group (so stopping it also
 * stops whatever it spawned, such as the node process under tsx), waits until
 * its readiness URL answers, and registers it to be stopped on shutdown.
 */
export async function startService(spec: ServiceSpec, options: ServiceOptions): Promise<RunningService> {
  for (const { port, role } of spec.ports) await assertPortFree(port, `${spec.description}, ${role}`);

  fs.mkdirSync(options.logDir, { recursive: true });
  const logFile = path.join(options.logDir, `${spec.name}.log`);
  const log = fs.createWriteStream(logFile, { flags: 'w' });
  const recent: string[] = [];
  const paintPrefix = prefixColours[servicesStarted++ % prefixColours.length]!;
  const prefix = `${paintPrefix(spec.name.padEnd(7))} ${colour.dim('│')} `;

  const child = spawn(spec.command, [...spec.args], {
    cwd: spec.cwd ?? REPO_ROOT,
    env: spec.env,
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
  });

  let spawnError: Error | undefined;
  child.once('error', (error) => (spawnError = error));

  const follow = (stream: Readable) => {
    readline.createInterface({ input: stream, crlfDelay: Infinity }).on('line', (line) => {
      log.write(`${line}\n`);
      recent.push(line);
      if (recent.length > RECENT_LINES) recent.shift();
      if (options.echo) console.log(prefix + line);
    });
  };
  follow(child.stdout);
  follow(child.stderr);
  child.once('close', () => log.end());

  let stopping = false;
  const exited = new Promise<ServiceExit>((resolve) => {
    child.once('exit', (code, signal) => resolve({ code, signal }));
  });

  const signalGroup = (signal: NodeJS.Signals) => {
    try {
      process.kill(-child.pid!, signal);
    } catch {
      // The group is already gone.
    }
  };

  const service: RunningService = {
    name: spec.name,
    description: spec.description,
    pid: child.pid ?? -1,
    logFile,
    recentOutput: () => recent.slice(-20).join('\n'),
    exited,
    async stop() {
      stopping = true;
      unregister();
      if (child.exitCode !== null || child.signalCode !== null) return;
      signalGroup('SIGTERM');
      const stoppedInTime = await Promise.race([exited.then(() => true), sleep(STOP_GRACE_MS).then(() => false)]);
      if (!stoppedInTime) {
        console.log(colour.yellow(`${spec.description} did not stop within ${STOP_GRACE_MS / 1000} s of SIGTERM; killing it.`));
        signalGroup('SIGKILL');
        await exited;
      }
    },
  };
  const unregister = onShutdown(spec.description, () => service.stop());

  const failure = (what: string) =>
    new SetupError(
      `${spec.description} ${what}.\nLast lines of its log (${path.relative(REPO_ROOT, logFile)}):\n` +
        (service.recentOutput() || '(it printed nothing)'),
    );

  const deadline = Date.now() + (spec.readyTimeoutMs ?? 60_000);
  let exitedEarly: ServiceExit | undefined;
  void exited.then((exit) => (exitedEarly = exit));
  for (;;) {
    if (spawnError !== undefined) {
      unregister();
      throw new SetupError(`Could not start ${spec.description} (${spec.command}): ${spawnError.message}`);
    }
    if (exitedEarly !== undefined) {
      // Give the last output lines a moment to reach the log.
      await sleep(100);
      throw failure(`${describeExit(exitedEarly)} before it was ready`);
    }
    try {
      const response = await fetch(spec.readyUrl, { signal: AbortSignal.timeout(2_000) });
      if (response.ok) break;
    } catch {
      // Not listening yet.
    }
    if (Date.now() > deadline) {
      await service.stop();
      throw failure(`did not become ready at ${spec.readyUrl} within ${Math.round((spec.readyTimeoutMs ?? 60_000) / 1000)} s`);
    }
    await sleep(200);
  }

  void exited.then((exit) => {
    if (!stopping) options.onUnexpectedExit?.(service, exit);
  });
  return service;
}
