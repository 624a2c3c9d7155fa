import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import express from 'express';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { webApp } from './web-app.ts';

const INDEX_HTML = '<!doctype html><html><head><title>Scrap Relay</title></head><body></body></html>';
let dist: string;

beforeAll(async () => {
  dist = await mkdtemp(path.join(tmpdir(), 'scrap-relay-web-app-'));
  await writeFile(path.join(dist, 'index.html'), INDEX_HTML);
});
afterAll(async () => {
  await rm(dist, { recursive: true, force: true });
});

describe('the shelf page when its head start cannot be worked out', () => {
  it('still serves the app when the session cannot be read, naming only the session', async () => {
    const app = express().use(
      webApp(dist, {
        signedIn: [(_req, _res, next) => next(new Error('the database is restarting'))],
        shelfPage: () => Promise.reject(new Error('not to be asked')),
        logger: pino({ level: 'silent' }),
      }),
    );
    const res = await request(app).get('/shelf').set('Cookie', 'sr.sid=s%3Asome-session.signature');
    expect(res.status).toBe(200);
    expect(res.text).toBe(INDEX_HTML);
    expect(res.headers.link).toBe('</api/session>; rel=preload; as=fetch; crossorigin');
  });

  it('still serves the app when the shelf cannot be read for a signed-in member', async () => {
    let asked = 0;
    const app = express().use(
      webApp(dist, {
        signedIn: [(req, _res, next) => ((req.user = { id: 'member' } as Express.User), next())],
        shelfPage: () => {
          asked += 1;
          return Promise.reject(new Error('the database is restarting'));
        },
        logger: pino({ level: 'silent' }),
      }),
    );
    const res = await request(app).get('/shelf').set('Cookie', 'sr.sid=s%3Asome-session.signature');
    expect(res.status).toBe(200);
    expect(res.text).toBe(INDEX_HTML);
    expect(res.headers.link).toBe('</api/session>; rel=preload; as=fetch; crossorigin');
    expect(asked).toBe(1);
  });
});
