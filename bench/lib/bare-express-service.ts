import { bin } from '../../scripts/lib/paths.ts';
import { startService, type RunningService } from '../../scripts/lib/services.ts';
import type { BenchContext } from './context.ts';

/** Starts bench/lib/bare-express.ts as its own process on `port` and waits until it answers. */
export function startBareExpress(ctx: BenchContext, port: number): Promise<RunningService> {
  return startService(
    {
      name: 'baseline',
      description: 'bare Express baseline',
      command: bin('tsx'),
      args: ['bench/lib/bare-express.ts'],
      env: { ...process.env, PORT: String(port), NODE_ENV: 'production' },
      ports: [{ port, role: 'HTTP' }],
      readyUrl: `http://127.0.0.1:${port}/baseline/health`,
    },
    { logDir: ctx.logDir, echo: false },
  );
}
