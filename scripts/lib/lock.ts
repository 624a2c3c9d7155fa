import fs from 'node:fs';
import path from 'node:path';
import { SetupError } from './errors.ts';
import { LOCAL_DIR } from './paths.ts';

interface LockContent {
  pid: number;
  url: string;
}

function isAlive(pid: number, script: string): boolean {
  try {
    process.kill(pid, 0);
  } catch (error) {
    // EPERM: alive but not ours to signal; ESRCH: gone.
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
  // A recycled pid belonging to some other program does not count.
  const cmdline = `/proc/${pid}/cmdline`;
  return !fs.existsSync(cmdline) || fs.readFileSync(cmdline, 'utf8').includes(script);
}

/**
 * A pid file under .local/ that makes a second `npm start` on the same ports
 * refuse to run instead of failing halfway on taken ports. A file left by a
 * crashed run (its pid no longer alive) is taken over.
 */
export function acquireRunLock(name: string, url: string, script: string): () => void {
  fs.mkdirSync(LOCAL_DIR, { recursive: true });
  const file = path.join(LOCAL_DIR, `${name}.pid`);
  const content: LockContent = { pid: process.pid, url };
  for (let attempt = 0; attempt < 2; attempt += 1) {
    try {
      fs.writeFileSync(file, JSON.stringify(content), { flag: 'wx' });
      return () => {
        try {
          const current = JSON.parse(fs.readFileSync(file, 'utf8')) as LockContent;
          if (current.pid === process.pid) fs.unlinkSync(file);
        } catch {
          // Already removed.
        }
      };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
    }
    let holder: LockContent | undefined;
    try {
      holder = JSON.parse(fs.readFileSync(file, 'utf8')) as LockContent;
    } catch {
      holder = undefined;
    }
    if (holder !== undefined && isAlive(holder.pid, script)) {
      throw new SetupError(`Scrap Relay is already running at ${holder.url} (pid ${holder.pid}).`);
    }
    fs.rmSync(file, { force: true });
  }
  throw new SetupError(`Could not take the lock file ${file}; remove it if no other \`npm start\` is running.`);
}
