import { mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CARD_PHOTO_SIZES } from '@scrap-relay/shared';
import { appWith, createMember, signedInClient, startTestApi, type Client, type TestApi } from './support/api.ts';
import { listAndSubmit } from './support/bundles.ts';

const INDEX_HTML = '<!doctype html><html lang="en"><head><title>Scrap Relay</title></head><body><div id="root"></div></body></html>';
const SESSION_LINK = '</api/session>; rel=preload; as=fetch; crossorigin';
/** A build manifest as Vite writes it: the entry, the shelf's route module, a chunk both import and one only the shelf does. */
const MANIFEST = {
  'index.html': { file: 'assets/index-a1.js', isEntry: true, imports: ['_shared-c3.js'], dynamicImports: ['src/app/routes/app/shelf/shelf.tsx'] },
  'src/app/routes/app/shelf/shelf.tsx': { file: 'assets/shelf-b2.js', isDynamicEntry: true, imports: ['index.html', '_shared-c3.js', '_units-d4.js'] },
  '_shared-c3.js': { file: 'assets/shared-c3.js' },
  '_units-d4.js': { file: 'assets/units-d4.js' },
};

let api: TestApi;
let dist: string;
let app: TestApi['runtime']['app'];
let member: Client;

/** The `Link` header split into its entries (commas inside quoted values stay). */
const linksOf = (header: string | undefined) => (header ?? '').match(/<[^>]*>(?:[^,"]|"[^"]*")*/g) ?? [];

beforeAll(async () => {
  api = await startTestApi();
  dist = await mkdtemp(path.join(tmpdir(), 'scrap-relay-dist-'));
  await writeFile(path.join(dist, 'index.html'), INDEX_HTML);
  await mkdir(path.join(dist, '.vite'));
  await writeFile(path.join(dist, '.vite', 'manifest.json'), JSON.stringify(MANIFEST));
  app = appWith(api, (config) => ({ ...config, webDist: dist }));
  const seller = await signedInClient(app, await createMember());
  const librarian = await signedInClient(app, await createMember({ roles: ['member', 'librarian'] }));
  const id = await listAndSubmit(seller, { title: 'Warm 5-inch squares for the early-start check' });
  expect((await librarian.send('post', `/api/bundles/${id}/review`, { decision: 'approve' })).status).toBe(200);
  member = await signedInClient(app, await createMember());
});
afterAll(async () => {
  await rm(dist, { recursive: true, force: true });
  await api.close();
});

describe('the shelf page names its first requests', () => {
  it('preloads the session, the first page of bundles, the first card’s photo and the route module for a signed-in member', async () => {
    const res = await member.get('/shelf');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('no-cache');
    // The route module's own files, after the page's own scripts; the chunk the entry already brings is left out.
    expect(res.text).toBe(
      INDEX_HTML.replace(
        '</head>',
        '<link rel="modulepreload" crossorigin href="/assets/shelf-b2.js"><link rel="modulepreload" crossorigin href="/assets/units-d4.js"></head>',
      ),
    );
    const [session, data, photo, ...rest] = linksOf(res.headers.link as string | undefined);
    expect(rest).toEqual([]);
    expect(session).toBe(SESSION_LINK);
    expect(data).toBe('</api/bundles?sort=newest&page=1&pageSize=24>; rel=preload; as=fetch; crossorigin');

    // The named request is one the API answers, and its first card is the photo named beside it.
    const page = await member.get('/api/bundles?sort=newest&page=1&pageSize=24');
    expect(page.status).toBe(200);
    const first = page.body.items[0] as { thumbUrl: string; thumb2xUrl: string };
    expect(photo).toBe(
      `<${first.thumbUrl}>; rel=preload; as=image; imagesrcset="${first.thumbUrl} 400w, ${first.thumb2xUrl} 800w"; imagesizes="${CARD_PHOTO_SIZES}"; fetchpriority=high`,
    );
  });

  it('names the request a filtered shelf address makes, leaving out what the API would refuse', async () => {
    const res = await member.get('/shelf/?fibre=quilting_cotton&sort=price_asc&colour=plaid&maxGrams=-1');
    const [, data] = linksOf(res.headers.link as string | undefined);
    expect(data).toBe('</api/bundles?fibre=quilting_cotton&sort=price_asc&page=1&pageSize=24>; rel=preload; as=fetch; crossorigin');
    expect((await member.get('/api/bundles?fibre=quilting_cotton&sort=price_asc&page=1&pageSize=24')).status).toBe(200);
  });

  it('names only the session for a visitor who is not signed in, or whose session cookie is not a session', async () => {
    for (const cookie of [undefined, 'sr.sid=s%3Anot-a-session.signature']) {
      const req = request(app).get('/shelf');
      const res = await (cookie ? req.set('Cookie', cookie) : req);
      expect(res.status).toBe(200);
      expect(res.text).toBe(INDEX_HTML);
      expect(res.headers.link).toBe(SESSION_LINK);
    }
  });

  it('names only the session on the app’s other pages', async () => {
    for (const address of ['/', '/orders', '/shelfish', '/shelf/other']) {
      const res = await member.get(address);
      expect(res.status, address).toBe(200);
      expect(res.text, address).toBe(INDEX_HTML);
      expect(res.headers.link, address).toBe(SESSION_LINK);
    }
  });

  it('never serves the build manifest as a file', async () => {
    const res = await member.get('/.vite/manifest.json');
    expect(res.text).toBe(INDEX_HTML);
  });
});
