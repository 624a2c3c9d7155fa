import type { Ports } from '../../scripts/lib/ports.ts';

/** What `npm run bench` hands each bench/*.bench.ts module's `run(ctx)`. */
export interface BenchContext {
  ports: Ports;
  /** The API's environment (see docs/LOCAL-SERVICES.md) plus MAILDEV_URL and STRIPE_FAKE_URL. */
  env: Record<string, string>;
  /** scrap_relay_bench: migrated, with the demo guild loaded. */
  databaseUrl: string;
  urls: { web: string; api: string; maildev: string; stripeFake: string };
  /** Where service logs go (.local/logs/bench-<base>/); pass it to startService for a module's own servers. */
  logDir: string;
  /** Prints one measured figure set under the current module's heading. */
  print(label: string, figures: Record<string, string | number>): void;
}

export type BenchModule = { run(ctx: BenchContext): Promise<void> };

function format(value: string | number): string {
  if (typeof value === 'string') return value;
  if (!Number.isFinite(value)) return String(value);
  const digits = Math.abs(value) >= 100 ? 0 : Math.abs(value) >= 10 ? 1 : 2;
  return value.toLocaleString('en-US', { maximumFractionDigits: digits, minimumFractionDigits: 0 });
}

export function formatFigures(label: string, figures: Record<string, string | number>): string {
  const parts = Object.entries(figures).map(([name, value]) => `${name} ${format(value)}`);
  return `  ${label.padEnd(56)} ${parts.join('   ')}`;
}
