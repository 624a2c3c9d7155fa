import { createHash } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';

/** The checkout this script runs from. */
export const REPO_ROOT = path.resolve(import.meta.dirname, '..', '..');

/** Per-checkout scratch space that stays out of git (.gitignore lists `.local/`). */
export const LOCAL_DIR = path.join(REPO_ROOT, '.local');

export function fromRoot(...parts: string[]): string {
  return path.join(REPO_ROOT, ...parts);
}

/**
 * A folder under the system temp folder, unique per checkout and user. The PostgreSQL
 * cluster lives here rather than in `.local/`: the server runs as the
 * `postgres` user, which must be able to traverse every parent folder, and a
 * checkout under a mode-700 home folder is not traversable.
 */
export function machineScratchDir(): string {
  // A non-root user is part of the name so two accounts using one checkout path never share a folder.
  const uid = process.getuid?.() ?? 0;
  const checkoutHash = createHash('sha256')
    .update(uid === 0 ? REPO_ROOT : `${REPO_ROOT}\0${uid}`)
    .digest('hex')
    .slice(0, 10);
  return path.join(os.tmpdir(), `scrap-relay-${checkoutHash}`);
}

export function bin(name: string): string {
  return path.join(REPO_ROOT, 'node_modules', '.bin', name);
}
