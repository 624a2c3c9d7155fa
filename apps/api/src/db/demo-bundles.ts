import sharp from 'sharp';
import type { Sequelize } from 'sequelize';
import { toHex, type BundleDraftInput } from '@scrap-relay/shared';
import { localStorage } from '../integrations/storage.ts';
import { processPhoto } from '../modules/bundles/photo-pipeline.ts';
import { Bundle, BundlePhoto, BundleReview, Meeting, Member } from './models/index.ts';

const DEMO_LIBRARIAN_EMAIL = 'lena@ferncombe-quilters.example';

interface DemoBundle extends BundleDraftInput {
  seller: string;
  state: 'on_shelf' | 'in_review';
  palette: string[];
  pattern: 'strips' | 'squares';
}

/** Invented listings for the demo guild; the photos are drawn here, not taken from anywhere. */
const DEMO_BUNDLES: DemoBundle[] = [
  {
    seller: 'ruth@ferncombe-quilters.example', state: 'on_shelf', palette: ['#2c3e73', '#f1e9d2', '#4a6fa5', '#d8cfb4'], pattern: 'strips',
    title: 'Indigo and cream 2½-inch strips', description: 'Width-of-fabric strips left over from a sampler quilt. All prewashed cotton, pressed and rolled.',
    offer: 'sale', priceMinor: 800, meetingHandoverOk: true, quantity: 1, weightGrams: 680, fibre: 'quilting_cotton', cutKinds: ['strips'], cutSizes: ['strip_2_5'],
    colourValue: 'medium', colourFamily: 'cool', prewashed: true, smokeFree: true, petFree: true, pieces: [],
  },
  {
    seller: 'gus@ferncombe-quilters.example', state: 'on_shelf', palette: ['#a0522d', '#d2a679', '#7b3f1d', '#e8c9a0'], pattern: 'squares',
    title: 'Flannel squares for a rag quilt', description: 'A bag of soft plaid flannel, mostly 5-inch squares. Free for the postage.',
    offer: 'postage_only', priceMinor: null, meetingHandoverOk: false, quantity: 1, weightGrams: 900, fibre: 'flannel', cutKinds: ['squares'], cutSizes: ['square_5'],
    colourValue: 'mixed', colourFamily: 'warm', prewashed: false, smokeFree: true, petFree: false, pieces: [],
  },
  {
    seller: 'ruth@ferncombe-quilters.example', state: 'on_shelf', palette: ['#e4572e', '#f3a712', '#a8201a', '#f6d55c'], pattern: 'squares',
    title: 'Batik fat quarters, sunset colours', description: 'Six fat quarters in oranges, golds and reds. Two identical packs.',
    offer: 'sale', priceMinor: 1500, meetingHandoverOk: false, quantity: 2, weightGrams: 215, fibre: 'batik', cutKinds: ['fat_quarters'],
    colourValue: 'medium', colourFamily: 'warm', prewashed: false, smokeFree: true, petFree: true, pieces: [{ widthMm: 457, heightMm: 559, count: 6 }],
  },
  {
    seller: 'gus@ferncombe-quilters.example', state: 'on_shelf', palette: ['#ffffff', '#222222', '#c0392b', '#2980b9', '#27ae60'], pattern: 'strips',
    title: 'Selvages for a selvage project', description: 'A jar of printed selvages with colour dots and names. Bring a bag to the meeting.',
    offer: 'meeting', priceMinor: null, meetingHandoverOk: false, quantity: 1, weightGrams: 250, fibre: 'quilting_cotton', cutKinds: ['selvages'],
    colourValue: 'mixed', colourFamily: 'multi', prewashed: false, smokeFree: true, petFree: true, pieces: [],
  },
  {
    seller: 'ada@ferncombe-quilters.example', state: 'on_shelf', palette: ['#f4f1ea', '#e6e0d4', '#d9d4c7', '#cfc8b8'], pattern: 'squares',
    title: 'Low-volume scraps for improv piecing', description: 'Irregular light prints, good for backgrounds and improv blocks.',
    offer: 'sale', priceMinor: 500, meetingHandoverOk: true, quantity: 1, weightGrams: 450, fibre: 'quilting_cotton', cutKinds: ['improv'],
    colourValue: 'light', colourFamily: 'neutral', prewashed: true, smokeFree: true, petFree: true, pieces: [],
  },
  {
    seller: 'gus@ferncombe-quilters.example', state: 'in_review', palette: ['#1b4332', '#52b788', '#95d5b2', '#2d6a4f'], pattern: 'strips',
    title: 'Orphan blocks and pre-joined binding', description: 'Four green orphan blocks and about 3 yards of joined 2½-inch binding.',
    offer: 'sale', priceMinor: 600, meetingHandoverOk: true, quantity: 1, weightGrams: 350, fibre: 'quilting_cotton', cutKinds: ['orphan_blocks', 'binding'],
    colourValue: 'dark', colourFamily: 'cool', prewashed: true, smokeFree: true, petFree: true, pieces: [],
  },
];

function artwork(b: DemoBundle): Buffer {
  const w = 1200;
  const h = 900;
  const shapes =
    b.pattern === 'strips'
      ? Array.from({ length: 12 }, (_, i) => `<rect x="0" y="${i * 75}" width="${w}" height="70" fill="${b.palette[i % b.palette.length]}" transform="rotate(-4 600 450)"/>`)
      : Array.from({ length: 48 }, (_, i) => `<rect x="${(i % 8) * 150 + 4}" y="${Math.floor(i / 8) * 150 + 4}" width="142" height="142" rx="6" fill="${b.palette[(i * 7) % b.palette.length]}"/>`);
  return Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}"><rect width="${w}" height="${h}" fill="#efe8da"/>${shapes.join('')}</svg>`);
}

/** Adds the demo listings and two coming meetings once; a second run finds them and changes nothing. */
export async function seedDemoShelf(sequelize: Sequelize, uploadDir: string, currency: string, now: Date): Promise<void> {
  const storage = localStorage(uploadDir);
  const meetings = await Meeting.count();
  if (meetings === 0) {
    // 7 pm in Ferncombe, whose guild keeps Pacific time: 03:00 UTC the next day in winter (8 pm in summer).
    const day = (n: number) => new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + n + 1, 3, 0));
    await Meeting.bulkCreate([
      { startsAt: day(9), place: 'Ferncombe Village Hall, back room', notes: 'Bring bundles to hand over in a labelled bag.', createdBy: null },
      { startsAt: day(37), place: 'Ferncombe Village Hall, back room', notes: 'Annual stash swap evening.', createdBy: null },
    ]);
  }
  // The librarian's approvals stand behind the listings on the shelf, as they would in use.
  const librarian = await Member.findOne({ where: { email: DEMO_LIBRARIAN_EMAIL } });
  for (const [index, demo] of DEMO_BUNDLES.entries()) {
    const seller = await Member.findOne({ where: { email: demo.seller } });
    if (!seller || (await Bundle.findOne({ where: { sellerId: seller.id, title: demo.title! } }))) continue;
    const photo = await processPhoto(await sharp(artwork(demo)).jpeg({ quality: 85 }).toBuffer());
    // The listings came in a day apart, the first of the list most recently, so the shelf's newest-first
    // order is the order above on every fresh demo guild (at one shared time it fell to the random ids);
    // the one still in review came in three hours ago.
    const submittedAt = new Date(now.getTime() - (demo.state === 'in_review' ? 3 : (index + 1) * 26) * 3_600_000);
    const onShelfAt = new Date(submittedAt.getTime() + 20 * 3_600_000);
    await sequelize.transaction(async (transaction) => {
      const { seller: _s, state, palette: _p, pattern: _pt, ...fields } = demo;
      const bundle = await Bundle.create(
        {
          ...fields,
          title: fields.title!,
          offer: fields.offer!,
          priceMinor: fields.priceMinor ?? null,
          weightGrams: fields.weightGrams!,
          fibre: fields.fibre!,
          colourValue: fields.colourValue ?? null,
          colourFamily: fields.colourFamily ?? null,
          sellerId: seller.id,
          currency,
          state,
          quantityAvailable: fields.quantity,
          submittedAt,
          reviewedAt: state === 'on_shelf' ? onShelfAt : null,
          onShelfAt: state === 'on_shelf' ? onShelfAt : null,
          expiresAt: state === 'on_shelf' ? new Date(onShelfAt.getTime() + 90 * 86_400_000) : null,
        },
        { transaction },
      );
      if (state === 'on_shelf' && librarian) {
        await BundleReview.create({ bundleId: bundle.id, reviewerId: librarian.id, decision: 'approve', notes: null, createdAt: onShelfAt }, { transaction });
      }
      const key = `photos/${bundle.id}/demo`;
      await storage.put(`${key}-1600.webp`, photo.display.data);
      await storage.put(`${key}-800.webp`, photo.medium.data);
      await storage.put(`${key}-400.webp`, photo.thumb.data);
      await BundlePhoto.create(
        { bundleId: bundle.id, position: 0, displayKey: `${key}-1600.webp`, mediumKey: `${key}-800.webp`, thumbKey: `${key}-400.webp`, contentType: photo.contentType, width: photo.display.width, height: photo.display.height, averageHex: toHex(photo.average) },
        { transaction },
      );
    });
  }
}
