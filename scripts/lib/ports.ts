import net from 'node:net';
import { SetupError } from './errors.ts';

/** Offsets from SR_PORT_BASE, as documented in docs/LOCAL-SERVICES.md. */
export interface Ports {
  base: number;
  web: number;
  api: number;
  smtp: number;
  maildevWeb: number;
  stripeFake: number;
  postgres: number;
}

export function portsFrom(base: number): Ports {
  return {
    base,
    web: base,
    api: base + 1,
    smtp: base + 2,
    maildevWeb: base + 3,
    stripeFake: base + 4,
    postgres: base + 5,
  };
}

export function portBaseFromEnv(defaultBase: number): number {
  const raw = process.env.SR_PORT_BASE;
  if (raw === undefined || raw.trim() === '') return defaultBase;
  const base = Number(raw);
  if (!Number.isInteger(base) || base < 1024 || base > 65_530) {
    throw new SetupError(`SR_PORT_BASE must be a whole number between 1024 and 65530 (got "${raw}").`);
  }
  return base;
}

/** Resolves true when nothing listens on 127.0.0.1:port (we can bind it ourselves). */
export function isPortFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const probe = net.createServer();
    probe.once('error', () => resolve(false));
    probe.once('listening', () => probe.close(() => resolve(true)));
    probe.listen({ port, host: '127.0.0.1', exclusive: true });
  });
}

export async function assertPortFree(port: number, service: string): Promise<void> {
  if (!(await isPortFree(port))) {
    throw new SetupError(
      `Port ${port} (${service}) is already in use by another program on 127.0.0.1.\n` +
        `Stop that program, or pick another port range with SR_PORT_BASE (for example SR_PORT_BASE=5300).`,
    );
  }
}
