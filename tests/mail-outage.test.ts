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
    const all = (await fetch(`http://127.0.0.1:${webPort}/api/email`).then((r) => r.json())) as { id: string; subject: string; to: { address: string }[] }[];
    const found = all.filter((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()));
    if (found.length) return found;
    await new Promise((r) => setTimeout(r, 500));
  }
  return [];
}

async function jobState(id: string): Promise<string | undefined> {
  const [rows] = await api.runtime.ctx.sequelize.query(`SELECT state FROM pgboss.job WHERE id = $1`, { bind: [id] });
  return (rows as { state: string }[])[0]?.state;
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

    // Recorded as sent, and sent under a Message-ID made from the job, so a second sending (the queue could not
    // record the first) reaches the recipient's mail system as the same message.
    const [[job]] = (await api.runtime.ctx.sequelize.query(`SELECT id, state FROM pgboss.job WHERE name = 'email-send' AND data->>'to' = $1`, {
      bind: [seller.email],
    })) as [{ id: string; state: string }[], unknown];
    const domain = /@([A-Za-z0-9.-]+)/.exec(api.runtime.ctx.config.smtp.from)![1];
    // maildev's list leaves the headers out; the message itself has them.
    const message = (await fetch(`http://127.0.0.1:${webPort}/api/email/${delivered[0]!.id}`).then((r) => r.json())) as { headers: Record<string, string> };
    expect(message.headers['message-id']).toBe(`<${job!.id}@${domain}>`);
    for (let i = 0; i < 20 && (await jobState(job!.id)) !== 'completed'; i++) await new Promise((r) => setTimeout(r, 250));
    expect(await jobState(job!.id)).toBe('completed');
  }, 70_000);
});
