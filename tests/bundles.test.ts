import fs from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { Bundle, BundlePhoto, type Member } from '../apps/api/src/db/models/index.ts';
import { expireBundles } from '../apps/api/src/jobs/scheduled.ts';
import { Client, countRows, createMember, signedInClient, startTestApi, type TestApi } from './support/api.ts';
import { completeListing, listAndSubmit } from './support/bundles.ts';
import { jpegPhoto, pngClaiming } from './support/photos.ts';
import { clearMail, listMail, waitForMail } from './support/services.ts';

let api: TestApi;
let seller: Member;
let sellerClient: Client;
let librarian: Member;
let librarianClient: Client;
let buyer: Member;
let buyerClient: Client;

beforeAll(async () => {
  api = await startTestApi();
  seller = await createMember({ name: 'Hetty Blanchard' });
  librarian = await createMember({ roles: ['member', 'librarian'], name: 'Ivo Lumb' });
  buyer = await createMember({ name: 'Pearl Dunmore' });
  sellerClient = await signedInClient(api.runtime.app, seller);
  librarianClient = await signedInClient(api.runtime.app, librarian);
  buyerClient = await signedInClient(api.runtime.app, buyer);
});
afterAll(async () => {
  await api.close();
});
beforeEach(async () => {
  await clearMail();
});

const upload = (client: Client, id: string, files: { data: Buffer; name: string; type?: string }[]) => {
  let req = client.agent.post(`/api/bundles/${id}/photos`).set('X-CSRF-Token', client.csrfToken);
  for (const f of files) req = req.attach('photos', f.data, { filename: f.name, contentType: f.type ?? 'image/jpeg' });
  return req;
};

async function newDraft(client = sellerClient, body: Record<string, unknown> = completeListing) {
  const res = await client.send('post', '/api/bundles', body);
  expect(res.status).toBe(201);
  return res.body.bundle.id as string;
}

describe('listing, review and the shelf', () => {
  it('goes from draft to review to the shelf, e-mails the seller, and another member finds it with a filter', async () => {
    const id = await newDraft(sellerClient, { title: 'Started draft' });
    const draft = await sellerClient.get(`/api/bundles/${id}`);
    expect(draft.body.bundle).toMatchObject({ state: 'draft', title: 'Started draft', abilities: { edit: true, submit: true } });

    const notYet = await sellerClient.send('post', `/api/bundles/${id}/submit`);
    expect(notYet.status).toBe(422);
    expect(Object.keys(notYet.body.error.fields)).toEqual(expect.arrayContaining(['offer', 'weightGrams', 'fibre', 'photos']));

    const { title: _t, ...rest } = completeListing;
    const patched = await sellerClient.send('patch', `/api/bundles/${id}`, { ...rest, title: 'Warm reds, fat quarters and strips', cutKinds: ['fat_quarters', 'strips'] });
    expect(patched.status).toBe(200);
    expect(patched.body.bundle.yield).toMatchObject({ fiveInchSquares: expect.any(Number) });
    expect(patched.body.bundle.cutPlan.totals).toMatchObject({ strip_2_5in: 14, square_5in: 56 });

    expect((await upload(sellerClient, id, [{ data: await jpegPhoto({ rgb: [200, 40, 40] }), name: 'a.jpg' }])).status).toBe(201);
    const submitted = await sellerClient.send('post', `/api/bundles/${id}/submit`);
    expect(submitted.status).toBe(200);
    expect(submitted.body.bundle.state).toBe('in_review');
    expect(submitted.body.bundle.colour.suggested).toMatchObject({ family: 'warm' });

    const queue = await librarianClient.get('/api/review-queue');
    expect(queue.status).toBe(200);
    const row = queue.body.items.find((r: { id: string }) => r.id === id);
    expect(row).toMatchObject({ photoCount: 1, seller: { firstName: 'Hetty', name: 'Hetty Blanchard' }, abilities: { review: true } });

    const hiddenFromOthers = await buyerClient.get(`/api/bundles/${id}`);
    expect(hiddenFromOthers.status).toBe(404);

    const approved = await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' });
    expect(approved.status).toBe(200);
    const row2 = await Bundle.findByPk(id);
    expect(row2!.state).toBe('on_shelf');
    expect(row2!.expiresAt!.getTime() - row2!.onShelfAt!.getTime()).toBe(90 * 24 * 3600 * 1000);

    const mail = await waitForMail({ to: seller.email, subjectIncludes: 'On the shelf' });
    expect(mail.text).toContain('Warm reds, fat quarters and strips');

    const found = await buyerClient.get('/api/bundles?cut=fat_quarters&family=cool&q=reds');
    expect(found.status).toBe(200);
    expect(found.body.items.map((b: { id: string }) => b.id)).toContain(id);
    const card = found.body.items.find((b: { id: string }) => b.id === id);
    expect(card).toMatchObject({ offer: 'sale', priceMinor: 1200, weightGrams: 454, thumbUrl: expect.stringMatching(/^\/uploads\/photos\//) });
    const missed = await buyerClient.get('/api/bundles?cut=selvages&q=reds');
    expect(missed.body.items.map((b: { id: string }) => b.id)).not.toContain(id);

    const page = await buyerClient.get(`/api/bundles/${id}`);
    expect(page.body.bundle).toMatchObject({ state: 'on_shelf', abilities: { buy: true, edit: false }, seller: { firstName: 'Hetty' } });

    expect(card.thumb2xUrl).toMatch(/^\/uploads\/photos\/.*-800\.webp$/);
    expect(card.thumb2xUrl).toBe(page.body.bundle.photos[0].mediumUrl);
    const thumb = await buyerClient.get(card.thumbUrl);
    expect(thumb.status).toBe(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
    expect(thumb.headers['x-content-type-options']).toBe('nosniff');
    expect(thumb.headers['cache-control']).toBe('private, max-age=31536000, immutable');
    // Photos are for members, like the shelf they are on: the address alone is not enough.
    const signedOut = await new Client(api.runtime.app).get(card.thumbUrl);
    expect(signedOut.status).toBe(401);
    expect(signedOut.headers['content-type']).toMatch(/^application\/json/);
  });

  it('pages through the shelf: later pages continue where the page before stopped, under the same count, and a text search counts four pages ahead', async () => {
    const word = `Quillwort${Date.now().toString(36)}`;
    for (let i = 0; i < 5; i++) {
      const id = await listAndSubmit(sellerClient, { title: `${word} offcuts ${i}`, priceMinor: 500 + i * 100 });
      expect((await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' })).status).toBe(200);
    }
    const idsOf = (res: { body: { items: { id: string }[] } }) => res.body.items.map((b) => b.id);

    // A text search (an unnamed statement) and a filtered price sort (a prepared one): page 1 in one
    // piece against the same bundles fetched two or three at a time; pages past the first read ids first.
    for (const [query, size] of [
      [`q=${word}`, 2],
      [`q=${word}&sort=price_desc`, 2],
      ['fibre=quilting_cotton&sort=price_asc', 3],
    ] as const) {
      const whole = await buyerClient.get(`/api/bundles?${query}&pageSize=60`);
      expect(whole.status).toBe(200);
      const total = whole.body.total as number;
      expect(total).toBeGreaterThanOrEqual(5);
      const pages = Math.min(3, Math.ceil(total / size));
      const pieced: string[] = [];
      for (let page = 1; page <= pages; page++) {
        const res = await buyerClient.get(`/api/bundles?${query}&pageSize=${size}&page=${page}`);
        expect(res.status).toBe(200);
        expect(res.body).toMatchObject({ page, pageSize: size, total, totalCapped: false });
        for (const card of res.body.items) expect(card.thumbUrl).toMatch(/^\/uploads\/photos\//);
        pieced.push(...idsOf(res));
      }
      expect(pieced).toEqual(idsOf(whole).slice(0, pages * size));
    }

    const prices = (await buyerClient.get(`/api/bundles?q=${word}&sort=price_desc&pageSize=2&page=2`)).body.items.map((b: { priceMinor: number }) => b.priceMinor);
    expect(prices).toEqual([700, 600]);
    const beyond = await buyerClient.get(`/api/bundles?q=${word}&pageSize=2&page=4`);
    expect(beyond.status).toBe(200);
    expect(beyond.body).toMatchObject({ items: [], page: 4, total: 5, totalCapped: false });

    // A text search counts four pages past the page asked for: with seven matches one to a page,
    // page 1 counts to five and says there are more; page 3 counts to seven, all there are.
    for (const i of [5, 6]) {
      const id = await listAndSubmit(sellerClient, { title: `${word} offcuts ${i}` });
      expect((await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' })).status).toBe(200);
    }
    expect((await buyerClient.get(`/api/bundles?q=${word}&pageSize=1&page=1`)).body).toMatchObject({ page: 1, total: 5, totalCapped: true });
    expect((await buyerClient.get(`/api/bundles?q=${word}&pageSize=1&page=3`)).body).toMatchObject({ page: 3, total: 7, totalCapped: false });
    expect((await buyerClient.get(`/api/bundles?q=${word}&pageSize=60`)).body).toMatchObject({ total: 7, totalCapped: false });
  });

  it('refuses to send a sale priced under the least card payment for review, naming the price', async () => {
    const id = await newDraft(sellerClient, { ...completeListing, priceMinor: 25 });
    expect((await upload(sellerClient, id, [{ data: await jpegPhoto(), name: 'a.jpg' }])).status).toBe(201);
    const refused = await sellerClient.send('post', `/api/bundles/${id}/submit`);
    expect(refused.status).toBe(422);
    // USD 0.50: Stripe's minimum charge amount (docs.stripe.com/currencies), from memory.
    expect(refused.body.error.fields.priceMinor).toMatch(/^Prices start at \$0\.50/);
    expect((await Bundle.findByPk(id))!.state).toBe('draft');
    expect((await sellerClient.send('patch', `/api/bundles/${id}`, { priceMinor: 50 })).status).toBe(200);
    expect((await sellerClient.send('post', `/api/bundles/${id}/submit`)).status).toBe(200);
  });

  it('returns a bundle with notes: the seller is e-mailed, edits and resubmits', async () => {
    const id = await listAndSubmit(sellerClient, { title: 'Batik bits <b>bold</b>' });
    const noNotes = await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'return' });
    expect(noNotes.status).toBe(400);
    expect(noNotes.body.error.fields.notes).toBeDefined();

    const returned = await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'return', notes: 'Please add a photo of the whole bag.' });
    expect(returned.status).toBe(200);
    const mail = await waitForMail({ to: seller.email, subjectIncludes: 'A note from the librarian' });
    expect(mail.text).toContain('Please add a photo of the whole bag.');
    expect(mail.html).toContain('Batik bits &lt;b&gt;bold&lt;/b&gt;');
    expect(mail.html).not.toContain('<b>bold</b>');

    const mine = await sellerClient.get(`/api/bundles/${id}`);
    expect(mine.body.bundle).toMatchObject({ state: 'returned', reviewNotes: 'Please add a photo of the whole bag.', abilities: { edit: true, submit: true } });
    expect((await upload(sellerClient, id, [{ data: await jpegPhoto(), name: 'whole-bag.jpg' }])).status).toBe(201);
    const again = await sellerClient.send('post', `/api/bundles/${id}/submit`);
    expect(again.body.bundle.state).toBe('in_review');
    const history = await librarianClient.get('/api/review-queue');
    expect(history.body.items.find((r: { id: string }) => r.id === id).seller.returnedCount).toBeGreaterThanOrEqual(1);
  });

  it('does not let a librarian review their own bundle', async () => {
    const ownId = await listAndSubmit(librarianClient);
    const res = await librarianClient.send('post', `/api/bundles/${ownId}/review`, { decision: 'approve' });
    expect(res.status).toBe(403);
    expect((await Bundle.findByPk(ownId))!.state).toBe('in_review');
    const queue = await librarianClient.get('/api/review-queue');
    expect(queue.body.items.find((r: { id: string }) => r.id === ownId).abilities.review).toBe(false);
  });

  it('does not let an ordinary member see the review queue or decide', async () => {
    const id = await listAndSubmit(sellerClient);
    expect((await buyerClient.get('/api/review-queue')).status).toBe(403);
    expect((await buyerClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' })).status).toBe(403);
  });

  it('withdraws a bundle from the shelf and relists it through review', async () => {
    const id = await listAndSubmit(sellerClient);
    await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' });
    const withdrawn = await sellerClient.send('post', `/api/bundles/${id}/withdraw`);
    expect(withdrawn.body.bundle).toMatchObject({ state: 'withdrawn', abilities: { relist: true } });
    expect((await buyerClient.get(`/api/bundles/${id}`)).status).toBe(404);
    expect((await sellerClient.send('post', `/api/bundles/${id}/submit`)).body.bundle.state).toBe('in_review');
  });

  it('takes bundles past the shelf limit off the shelf and tells the seller', async () => {
    const id = await listAndSubmit(sellerClient, { title: 'Old flannel squares', fibre: 'flannel' });
    await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' });
    api.clock.advance(91 * 24 * 3600 * 1000);
    try {
      expect(await expireBundles(api.runtime.ctx)).toBeGreaterThanOrEqual(1);
    } finally {
      api.clock.reset();
    }
    const mine = await sellerClient.get(`/api/bundles/${id}`);
    expect(mine.body.bundle).toMatchObject({ state: 'expired', abilities: { relist: true } });
    await waitForMail({ to: seller.email, subjectIncludes: 'Off the shelf after 91 days' });
  });
});

describe('photos', () => {
  it('strips location and camera metadata and makes a display size, a medium size and a thumbnail', async () => {
    const id = await newDraft();
    const res = await upload(sellerClient, id, [{ data: await jpegPhoto({ width: 3000, height: 2000, withGps: true }), name: 'phone.jpg' }]);
    expect(res.status).toBe(201);
    const photo = await BundlePhoto.findOne({ where: { bundleId: id } });
    expect(photo!.mediumKey).toEqual(expect.stringMatching(/-800\.webp$/));
    for (const key of [photo!.displayKey, photo!.mediumKey!, photo!.thumbKey]) {
      const file = await fs.readFile(path.join(api.config.uploadDir, key));
      const meta = await sharp(file).metadata();
      expect(meta.exif).toBeUndefined();
      expect(file.includes(Buffer.from('PocketCam'))).toBe(false);
      expect(file.includes(Buffer.from('GPS'))).toBe(false);
      expect(meta.format).toBe('webp');
    }
    expect(res.body.bundle.photos[0]).toMatchObject({ width: 1600, height: 1067 });
    const thumb = await sharp(await fs.readFile(path.join(api.config.uploadDir, photo!.thumbKey))).metadata();
    expect(Math.max(thumb.width!, thumb.height!)).toBe(400);
    const medium = await sharp(await fs.readFile(path.join(api.config.uploadDir, photo!.mediumKey!))).metadata();
    expect([medium.width, medium.height]).toEqual([800, 534]);
    expect(res.body.bundle.photos[0].mediumUrl).toBe(`/uploads/${photo!.mediumKey}`);
  });

  it('refuses a text file named .jpg with 415 and keeps nothing', async () => {
    const id = await newDraft();
    const before = await countRows(api.runtime.ctx.sequelize, ['bundle_photos']);
    const res = await upload(sellerClient, id, [{ data: Buffer.from('just some words, not a photo'), name: 'notes.jpg' }]);
    expect(res.status).toBe(415);
    expect(res.body.error.fields.photos).toBeDefined();
    expect(await countRows(api.runtime.ctx.sequelize, ['bundle_photos'])).toEqual(before);
  });

  it('refuses a 20000 × 20000 image with 422', async () => {
    const id = await newDraft();
    const res = await upload(sellerClient, id, [{ data: pngClaiming(20_000, 20_000), name: 'huge.png', type: 'image/png' }]);
    expect(res.status).toBe(422);
    expect(res.body.error.fields.photos).toMatch(/too large/);
  });

  it('refuses a ninth photo with 400', async () => {
    const id = await newDraft();
    const photo = await jpegPhoto({ width: 200, height: 150 });
    const eight = Array.from({ length: 8 }, (_, i) => ({ data: photo, name: `p${i}.jpg` }));
    expect((await upload(sellerClient, id, eight)).status).toBe(201);
    const ninth = await upload(sellerClient, id, [{ data: photo, name: 'p9.jpg' }]);
    expect(ninth.status).toBe(400);
    expect(ninth.body.error.fields.photos).toMatch(/8/);
    expect(await BundlePhoto.count({ where: { bundleId: id } })).toBe(8);
    const nine = Array.from({ length: 9 }, (_, i) => ({ data: photo, name: `q${i}.jpg` }));
    const other = await newDraft();
    expect((await upload(sellerClient, other, nine)).status).toBe(400);
    expect(await BundlePhoto.count({ where: { bundleId: other } })).toBe(0);
  });

  it('reorders and deletes photos', async () => {
    const id = await newDraft();
    const res = await upload(sellerClient, id, [
      { data: await jpegPhoto({ rgb: [10, 10, 10] }), name: 'dark.jpg' },
      { data: await jpegPhoto({ rgb: [240, 240, 240] }), name: 'light.jpg' },
    ]);
    const [first, second] = res.body.bundle.photos;
    const reordered = await sellerClient.send('put', `/api/bundles/${id}/photos/order`, { photoIds: [second.id, first.id] });
    expect(reordered.body.bundle.photos.map((p: { id: string }) => p.id)).toEqual([second.id, first.id]);
    const deleted = await sellerClient.send('delete', `/api/bundles/${id}/photos/${second.id}`);
    expect(deleted.body.bundle.photos.map((p: { id: string }) => p.id)).toEqual([first.id]);
    for (const size of [400, 800, 1600]) {
      await expect(fs.access(path.join(api.config.uploadDir, `photos/${id}/${second.id}-${size}.webp`))).rejects.toThrow();
    }
    await expect(fs.access(path.join(api.config.uploadDir, `photos/${id}/${first.id}-800.webp`))).resolves.toBeUndefined();
  });
});

describe('bad listing input', () => {
  it.each([
    ['a negative weight', { weightGrams: -5 }, 'weightGrams'],
    ['a price on a free offer', { offer: 'postage_only', priceMinor: 500 }, 'priceMinor'],
    ['an unknown fibre', { fibre: 'spider_silk' }, 'fibre'],
    ['a fractional price', { priceMinor: 12.5 }, 'priceMinor'],
    ['an unknown cut kind', { cutKinds: ['mystery_cut'] }, 'cutKinds.0'],
    ['a zero quantity', { quantity: 0 }, 'quantity'],
    ['a piece of negative width', { pieces: [{ widthMm: -1, heightMm: 100, count: 1 }] }, 'pieces.0.widthMm'],
  ])('refuses %s with 400 naming the field, writing nothing', async (_label, body, field) => {
    const before = await countRows(api.runtime.ctx.sequelize, ['bundles']);
    const res = await sellerClient.send('post', '/api/bundles', { ...completeListing, ...body });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toBeDefined();
    expect(await countRows(api.runtime.ctx.sequelize, ['bundles'])).toEqual(before);
  });

  it('refuses a price on a bundle that is already a free offer', async () => {
    const id = await newDraft(sellerClient, { ...completeListing, offer: 'meeting', priceMinor: null, meetingHandoverOk: false });
    const res = await sellerClient.send('patch', `/api/bundles/${id}`, { priceMinor: 300 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.priceMinor).toBeDefined();
  });

  it('clears the price when the seller switches a sale to a free offer', async () => {
    const id = await newDraft();
    const res = await sellerClient.send('patch', `/api/bundles/${id}`, { offer: 'postage_only' });
    expect(res.status).toBe(200);
    expect(res.body.bundle).toMatchObject({ offer: 'postage_only', priceMinor: null, meetingHandoverOk: false });
  });

  it('answers 403 when a member edits another member’s bundle', async () => {
    const id = await newDraft();
    const res = await buyerClient.send('patch', `/api/bundles/${id}`, { title: 'Mine now' });
    expect(res.status).toBe(403);
    expect((await Bundle.findByPk(id))!.title).toBe(completeListing.title);
    expect((await upload(buyerClient, id, [{ data: await jpegPhoto(), name: 'x.jpg' }])).status).toBe(403);
    expect((await buyerClient.send('post', `/api/bundles/${id}/submit`)).status).toBe(403);
    expect((await buyerClient.send('post', `/api/bundles/${id}/withdraw`)).status).toBe(403);
  });

  it('refuses listing before the e-mail address is confirmed', async () => {
    const unverified = await createMember({ verified: false });
    const client = await signedInClient(api.runtime.app, unverified);
    const res = await client.send('post', '/api/bundles', completeListing);
    expect(res.status).toBe(403);
  });

  it('refuses unknown shelf filters with 400 naming them', async () => {
    const res = await buyerClient.get('/api/bundles?fibre=spider_silk&sort=sideways&page=0&size=strip_7');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['fibre', 'page', 'size', 'sort']);
  });

  it('finds bundles by strip width or square size, and keeps each size with its cut kind', async () => {
    const word = 'sizecheck';
    const strips = await listAndSubmit(sellerClient, { title: `${word} strips`, cutKinds: ['strips', 'squares'], cutSizes: ['strip_2_5', 'square_5'] });
    const wide = await listAndSubmit(sellerClient, { title: `${word} wide strips`, cutKinds: ['strips'], cutSizes: ['strip_5'] });
    for (const id of [strips, wide]) expect((await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' })).status).toBe(200);
    const found = async (query: string) =>
      ((await buyerClient.get(`/api/bundles?q=${word}&${query}`)).body.items as { id: string }[]).map((b) => b.id).sort();
    expect(await found('size=strip_2_5')).toEqual([strips]);
    expect(await found('size=square_5&cut=squares')).toEqual([strips]);
    expect(await found('size=strip_5')).toEqual([wide]);
    expect(await found('size=square_10')).toEqual([]);
    expect((await buyerClient.get(`/api/bundles/${strips}`)).body.bundle.cutSizes).toEqual(['strip_2_5', 'square_5']);

    // A square size needs squares among the cut kinds; unticking a kind drops its sizes with it.
    const draft = await newDraft(sellerClient, { ...completeListing, cutKinds: ['strips'], cutSizes: ['strip_2_5'] });
    const unknown = await sellerClient.send('patch', `/api/bundles/${draft}`, { cutSizes: ['strip_9'], title: 'Not saved' });
    expect(unknown.status).toBe(400);
    expect(Object.keys(unknown.body.error.fields)).toEqual(['cutSizes.0']);
    expect((await Bundle.findByPk(draft))!.title).toBe(completeListing.title);
    const mismatch = await sellerClient.send('patch', `/api/bundles/${draft}`, { cutSizes: ['square_10'] });
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.error.fields.cutSizes).toBe('10-inch squares need Squares among the cut kinds.');
    const unticked = await sellerClient.send('patch', `/api/bundles/${draft}`, { cutKinds: ['yardage'] });
    expect(unticked.status).toBe(200);
    expect(unticked.body.bundle).toMatchObject({ cutKinds: ['yardage'], cutSizes: [] });
  });
});

describe('the yield estimate', () => {
  it('answers for a weight and fibre, with a cut plan for listed pieces', async () => {
    // Check values from ../shared/CHECKS.md (common practice): a fat quarter, 18 × 22 in, gives 12 five-inch squares.
    const res = await sellerClient.send('post', '/api/estimates/yield', {
      weightGrams: 454,
      fibre: 'quilting_cotton',
      pieces: [{ widthMm: 457, heightMm: 559, count: 2 }],
    });
    expect(res.status).toBe(200);
    expect(res.body.cutPlan.totals.square_5in).toBe(24);
    expect(res.body.yield.gsm).toBe(140);
  });
});

describe('wishes', () => {
  it('sends one e-mail per matching wish when a bundle is approved, never to the seller, never twice', async () => {
    const created = await buyerClient.send('post', '/api/wishes', { name: 'Dark batik', filters: { fibre: 'batik', value: 'dark' } });
    expect(created.status).toBe(201);
    const other = await buyerClient.send('post', '/api/wishes', { name: 'Selvages', filters: { cut: 'selvages' } });
    expect(other.status).toBe(201);
    // A size the new bundle does not have: no e-mail for this one.
    const wide = await buyerClient.send('post', '/api/wishes', { name: 'Dark batik, 5-inch strips', filters: { fibre: 'batik', size: 'strip_5' } });
    expect(wide.status).toBe(201);
    await sellerClient.send('post', '/api/wishes', { name: 'My own batik', filters: { fibre: 'batik' } });

    const id = await listAndSubmit(sellerClient, { title: 'Dark batik offcuts', fibre: 'batik', colourValue: 'dark', cutSizes: ['strip_2_5'] });
    await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' });
    const mail = await waitForMail({ to: buyer.email, subjectIncludes: 'Dark batik' });
    expect(mail.text).toContain('Dark batik offcuts');

    await sellerClient.send('post', `/api/bundles/${id}/withdraw`);
    await sellerClient.send('post', `/api/bundles/${id}/submit`);
    await librarianClient.send('post', `/api/bundles/${id}/review`, { decision: 'approve' });
    await waitForMail({ to: seller.email, subjectIncludes: 'On the shelf' });
    const all = await listMail();
    expect(all.filter((m) => m.to.includes(buyer.email) && m.subject.includes('your wish')).length).toBe(1);
    expect(all.filter((m) => m.to.includes(seller.email) && m.subject.includes('your wish')).length).toBe(0);
    expect(all.some((m) => m.subject.includes('5-inch strips'))).toBe(false);

    const list = await buyerClient.get('/api/wishes');
    expect(list.body.items.map((w: { name: string }) => w.name).sort()).toEqual(['Dark batik', 'Dark batik, 5-inch strips', 'Selvages']);
    expect((await buyerClient.send('delete', `/api/wishes/${other.body.wish.id}`)).status).toBe(204);
    expect((await sellerClient.send('delete', `/api/wishes/${created.body.wish.id}`)).status).toBe(404);
  });

  it('refuses a wish with no filters', async () => {
    const res = await buyerClient.send('post', '/api/wishes', { name: 'Anything', filters: {} });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.filters).toBeDefined();
  });
});
