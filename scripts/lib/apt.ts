import { SetupError } from './errors.ts';
import { runCommand, tail } from './run.ts';

/**
 * Installs one Debian package as root. Another apt run (a fresh machine's unattended upgrades, a second
 * checkout setting itself up) holds apt's locks for a while; apt waits up to ten minutes for them instead
 * of failing at once.
 */
export async function aptInstall(pkg: string): Promise<void> {
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const wait = ['-o', 'DPkg::Lock::Timeout=600', '-o', 'Acquire::Lock::Timeout=600'];
  for (const args of [[...wait, 'update'], [...wait, 'install', '-y', pkg]]) {
    const result = await runCommand('apt-get', args, { env, capture: true });
    if (result.code !== 0) throw new SetupError(`apt-get ${args.join(' ')} failed:\n${tail(result.stdout + result.stderr)}`);
  }
}
