import { spawn } from 'node:child_process';
import os from 'node:os';
import { onShutdown } from './lifecycle.ts';

export interface RunOptions {
  cwd?: string;
  env?: NodeJS.ProcessEnv;
  /** Collect stdout/stderr instead of passing them through to the terminal. */
  capture?: boolean;
}

export interface RunResult {
  code: number;
  stdout: string;
  stderr: string;
}

/**
 * Runs a command to completion. Never throws on a non-zero exit: callers
 * decide what a failure means. A command still running when the script shuts
 * down (Ctrl-C during a test run) is terminated with it.
 */
export function runCommand(command: string, args: readonly string[], options: RunOptions = {}): Promise<RunResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, {
      cwd: options.cwd,
      env: options.env ?? process.env,
      stdio: options.capture ? ['ignore', 'pipe', 'pipe'] : 'inherit',
    });
    let stdout = '';
    let stderr = '';
    child.stdout?.setEncoding('utf8').on('data', (chunk: string) => (stdout += chunk));
    child.stderr?.setEncoding('utf8').on('data', (chunk: string) => (stderr += chunk));

    const unregister = onShutdown(`${command} ${args.join(' ')}`, async () => {
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
    });
    child.once('error', (error) => {
      unregister();
      reject(error);
    });
    child.once('close', (code, signal) => {
      unregister();
      // A signal death counts as failure; 128 + n is the shell convention.
      resolve({ code: code ?? 128 + (signal === null ? 0 : os.constants.signals[signal]), stdout, stderr });
    });
  });
}

/** The last lines of some output, for error messages. */
export function tail(text: string, lines = 20): string {
  return text.trimEnd().split('\n').slice(-lines).join('\n');
}
