import { SetupError } from './errors.ts';
import { colour, failure, warning } from './log.ts';

interface Cleanup {
  label: string;
  run: () => Promise<void>;
}

const cleanups: Cleanup[] = [];
let shuttingDown: Promise<void> | undefined;

/**
 * Registers something to undo when the command ends, however it ends (normal
 * end, error, Ctrl-C, SIGTERM, SIGHUP). Cleanups run last-registered first, so
 * services stop in the reverse of their start order and PostgreSQL goes last.
 * Returns a function that unregisters it (for things stopped early on purpose).
 */
export function onShutdown(label: string, run: () => Promise<void>): () => void {
  const entry: Cleanup = { label, run };
  cleanups.push(entry);
  return () => {
    const index = cleanups.indexOf(entry);
    if (index >= 0) cleanups.splice(index, 1);
  };
}

export function isShuttingDown(): boolean {
  return shuttingDown !== undefined;
}

/** Runs every registered cleanup once; later calls wait for the same run. */
export function shutdown(): Promise<void> {
  shuttingDown ??= (async () => {
    while (cleanups.length > 0) {
      const cleanup = cleanups.pop()!;
      try {
        await cleanup.run();
      } catch (error) {
        warning(`Could not stop ${cleanup.label}: ${error instanceof Error ? error.message : String(error)}`);
      }
    }
  })();
  return shuttingDown;
}

const signalExitCodes: Record<string, number> = { SIGINT: 130, SIGTERM: 143, SIGHUP: 129 };

function installSignalHandlers(): void {
  let received = 0;
  let firstAt = 0;
  for (const signal of Object.keys(signalExitCodes) as NodeJS.Signals[]) {
    process.on(signal, () => {
      // npm and tsx pass a signal on to us as well, so one Ctrl-C or kill can arrive twice at once.
      if (received > 0 && Date.now() - firstAt < 1_000) return;
      if (received === 0) firstAt = Date.now();
      received += 1;
      if (received === 1) {
        console.log(`\n${colour.yellow(`${signal} received: stopping everything this command started…`)}`);
        void shutdown().finally(() => {
          console.log(colour.green('Everything this command started is stopped.'));
          process.exit(signalExitCodes[signal]);
        });
      } else if (received === 2) {
        console.log(colour.yellow('Still stopping; press Ctrl-C once more to leave without waiting.'));
      } else {
        process.exit(signalExitCodes[signal]);
      }
    });
  }
}

export function describeError(error: unknown): string {
  if (error instanceof SetupError) return error.message;
  if (error instanceof Error) return error.stack ?? error.message;
  return String(error);
}

/**
 * Runs a command's main function: signals and errors lead to an orderly
 * shutdown, and the process exits with main's exit code (1 on error).
 */
export async function runMain(main: () => Promise<number>): Promise<void> {
  installSignalHandlers();
  let exitCode: number;
  try {
    exitCode = await main();
  } catch (error) {
    failure(colour.red(describeError(error)));
    exitCode = 1;
  }
  await shutdown();
  process.exit(exitCode);
}
