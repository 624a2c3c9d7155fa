import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort } from './support/net.ts';
import { createMember, signedInClient, startTestApi, type TestApi } from './support/api.ts';
import { listAndSubmit } from './support/bundles.ts';

/** A mail server that is down delays mail, never loses it: the approval e-mail waits in the queue and goes once one is back. */
let api: TestApi;
let smtpPort: number;
let webPort: number;
let maildev: ChildProcess | undefined;

beforeAll(async () => {
  smtpPort = await freePort();
  webPort = await freePort();
  api = await startTestApi({ SMTP_PORT: String(smtpPort) });
});
afterAll(async () => {
  maildev?.kill('SIGTERM');
  await api.close();
});

async function startMaildev() {
  const bin = path.resolve(import.meta.dirname, '../node_modules/.bin/maildev');
  maildev = spawn(bin, ['--ip', '127.0.0.1', '--smtp', String(smtpPort), '--web-ip', '127.0.0.1', '--web', String(webPort)], { stdio: 'ignore' });
  for (let i = 0; i < 50; i++) {
    const ok = await fetch(`http://127.0.0.1:${webPort}/api/healthz`).then((r) => r.ok).catch(() => false);
    if (ok) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('maildev did not start');
}

async function mailTo(address: string, timeoutMs: number) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const all = (await fetch(`http://127.0.0.1:${webPort}/api/email`).then((r) => r.json())) as { subject: string; to: { address: string }[] }[];
    const found = all.filter((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()));
    if (found.length) return found;
    await new Promise((r) => setTimeout(r, 500));
  }
  return [];
}

describe('mail server down during an approval', () => {
  it('delivers the approval e-mail once the mail server is back, exactly once', async () => {
    const seller = await createMember();
    const librarian = await createMember({ roles: ['member', 'librarian'] });
    const sellerClient = await signedInClient(api.runtime.app, seller);
    const librarianClient = await signedInClient(api.runtime.app, librarian);
    const id = await listAndSubmit(sellerClient, { title: 'Linen offcuts for a patient day' });

    const approved = await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' });
    expect(approved.status).toBe(200);

    // Let the worker try and fail at least once against the closed port.
    await new Promise((r) => setTimeout(r, 2_500));
    const [waiting] = await api.runtime.ctx.sequelize.query(
      `SELECT state, retry_count FROM pgboss.job WHERE name = 'email-send' AND data->>'to' = $1`,
      { bind: [seller.email] },
    );
    expect(waiting).toEqual([expect.objectContaining({ state: expect.stringMatching(/retry|active|created/) })]);

    await startMaildev();
    const delivered = await mailTo(seller.email, 45_000);
    expect(delivered.map((m) => m.subject)).toEqual(['On the shelf: Linen offcuts for a patient day']);
  }, 70_000);
});
